import { Router, type Request } from "express";
import type { Transaction } from "sequelize";
import { instrumentUsableOn, utcDay } from "../../shared/quality/instruments";
import {
  calibrationRecordSchema, instrumentCreateSchema, instrumentListQuerySchema, instrumentSendSchema, instrumentUpdateSchema, MAX_CERTIFICATE_BYTES,
} from "../../shared/schemas/instrument";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { createReceiver, discardUploads } from "../files/receive";
import { parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Event, Instrument, InstrumentCalibration, StoredFile, User } from "../models";
import { instrumentPolicy } from "../policies/instrument";
import { authorize, requireRole } from "../policies/utils";
import { presentInstrument, presentInstrumentDetail } from "../presenters/instrument";
import { calibrationRecorder, checkCertificate, instrumentSender } from "../services/instrumentCalibrator";
import { instrumentCreator, instrumentUpdater } from "../services/instrumentSaver";

const withCertificate = [{ model: StoredFile, as: "currentCertificate" }];

/** The instrument (locked when a transaction is given) with its current certificate. */
async function loadInstrument(id: unknown, transaction?: Transaction): Promise<Instrument> {
  const instrument = await Instrument.findByPk(recordId(id, "instrument"), { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!instrument) throw NotFoundError("instrument");
  instrument.currentCertificate = instrument.currentCertificateId ? await StoredFile.findByPk(instrument.currentCertificateId, { transaction }) : null;
  return instrument;
}

/** The register of test instruments and their calibrations (quality inspectors and the planner). */
export function instrumentsRouter({ sequelize, files: store }: AppDeps): Router {
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;
  const receiveCertificate = createReceiver({ store, field: "file", maxBytes: MAX_CERTIFICATE_BYTES, maxFiles: 1, what: "calibration certificate" });

  router.get("/instruments", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const query = parseInput(instrumentListQuerySchema, req.query);
    const rows = await Instrument.findAll({ where: query.kind ? { kind: query.kind } : {}, include: withCertificate, order: [["calibrationDue", "ASC"], ["name", "ASC"]] });
    const today = utcDay(new Date());
    const shown = query.usable === undefined ? rows : rows.filter((i) => instrumentUsableOn(i, today) === (query.usable === "true"));
    res.json(shown.map((i) => presentInstrument(i, req.user!, today)));
  });

  router.post("/instruments", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const input = parseInput(instrumentCreateSchema, req.body);
    const instrument = await sequelize.transaction((transaction) => instrumentCreator({ actor: req.user!, input, ip: ip(req), transaction }));
    instrument.currentCertificate = null;
    res.status(201).json(presentInstrument(instrument, req.user!));
  });

  router.get("/instruments/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const instrument = await loadInstrument(req.params.id);
    authorize(req.user!, "read", instrumentPolicy, instrument);
    const [calibrations, events] = await Promise.all([
      InstrumentCalibration.findAll({ where: { instrumentId: instrument.id }, include: [{ model: StoredFile, as: "file" }], order: [["calibratedOn", "DESC"], ["createdAt", "DESC"]] }),
      Event.findAll({ where: { subjectType: "instrument", subjectId: instrument.id }, order: [["createdAt", "DESC"], ["id", "DESC"]], limit: 200 }),
    ]);
    const ids = new Set<string>();
    for (const c of calibrations) if (c.recordedById) ids.add(c.recordedById);
    for (const e of events) if (e.actorId) ids.add(e.actorId);
    const people = new Map((ids.size ? await User.findAll({ where: { id: [...ids] }, attributes: ["id", "name"] }) : []).map((u) => [u.id, u]));
    res.json(presentInstrumentDetail(instrument, { calibrations, events, people }, req.user!));
  });

  router.patch("/instruments/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const input = parseInput(instrumentUpdateSchema, req.body);
    const instrument = await sequelize.transaction(async (transaction) => {
      const instrument = await loadInstrument(req.params.id, transaction);
      authorize(req.user!, "update", instrumentPolicy, instrument);
      return instrumentUpdater({ actor: req.user!, instrument, input, ip: ip(req), transaction });
    });
    res.json(presentInstrument(instrument, req.user!));
  });

  router.post("/instruments/:id/send-to-calibration", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const input = parseInput(instrumentSendSchema, req.body);
    const instrument = await sequelize.transaction(async (transaction) => {
      const instrument = await loadInstrument(req.params.id, transaction);
      authorize(req.user!, "sendToCalibration", instrumentPolicy, instrument);
      return instrumentSender({ actor: req.user!, instrument, input, ip: ip(req), transaction });
    });
    res.json(presentInstrument(instrument, req.user!));
  });

  // A calibration with its certificate (multipart: "file" and the form fields of calibrationRecordSchema):
  // "return" brings an instrument back from the laboratory, "calibrations" records one done in place.
  for (const [path, returning] of [["return-from-calibration", true], ["calibrations", false]] as const) {
    router.post(`/instruments/:id/${path}`, requireUser, async (req, res) => {
      // who may upload is settled before the body is read, so nobody else's upload is ever stored
      requireRole(req.user!, "qa", "admin");
      const before = await loadInstrument(req.params.id);
      authorize(req.user!, returning ? "returnFromCalibration" : "recordCalibration", instrumentPolicy, before);
      const { files, fields } = await receiveCertificate(req, res);
      try {
        const input = parseInput(calibrationRecordSchema, fields);
        const certificate = await checkCertificate(files);
        const instrument = await sequelize.transaction(async (transaction) => {
          const instrument = await loadInstrument(req.params.id, transaction);
          return calibrationRecorder({ actor: req.user!, instrument, input, certificate, returning, store, ip: ip(req), transaction });
        });
        res.status(201).json(presentInstrument(instrument, req.user!));
      } finally {
        await discardUploads(files);
      }
    });
  }

  // Certificates go to the shop's quality staff only, always as a download.
  router.get("/instruments/:id/certificates/:fileId", requireUser, async (req, res) => {
    requireRole(req.user!, "qa", "admin");
    const instrument = await loadInstrument(req.params.id);
    const fileId = recordId(req.params.fileId, "certificate");
    const record = await InstrumentCalibration.findOne({ where: { instrumentId: instrument.id, storedFileId: fileId }, include: [{ model: StoredFile, as: "file" }] });
    const file = record?.file;
    if (!file) throw NotFoundError("certificate");
    res.attachment(file.filename);
    res.type(file.contentType);
    res.set({ "Cache-Control": "private, no-store", "Content-Security-Policy": "default-src 'none'; sandbox" });
    res.sendFile(store.pathOf(file.storageKey), { dotfiles: "deny", headers: { "Content-Type": file.contentType } });
  });

  return router;
}
