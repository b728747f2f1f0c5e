import { Router } from "express";
import { Op, type WhereOptions } from "sequelize";
import { z } from "zod";
import { invitationCreateSchema, userAccessUpdateSchema } from "../../shared/schemas/auth";
import type { UserEventJson } from "../../shared/schemas/people";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { NotFoundError } from "../errors";
import { AuthToken, Event, Organization, User } from "../models";
import { organizationPolicy } from "../policies/organization";
import { authorize, requireRole } from "../policies/utils";
import { presentInvitation } from "../presenters/invitation";
import { presentOrganization } from "../presenters/organization";
import { presentUser } from "../presenters/user";
import { invitationCreator } from "../services/invitationCreator";
import { invitationResender, invitationWithdrawer } from "../services/invitationResender";
import { userAccessChanger } from "../services/userAccessChanger";
import { invitationMail } from "../services/mail-texts";
import { roleLabels } from "../../shared/schemas/roles-labels";

const idParam = z.object({ id: z.uuid({ error: "That is not a record id." }) });
const eventsQuery = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) });

const listQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  q: z.string().trim().max(100).optional(),
});

/** Users, organisations and invitations: the planner's people pages. */
export function usersRouter({ sequelize, mailer, config }: AppDeps): Router {
  const router = Router();
  router.get("/users", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { page, pageSize, q } = parseInput(listQuery, req.query);
    const where: WhereOptions = q ? { [Op.or]: [{ email: { [Op.iLike]: `%${q}%` } }, { name: { [Op.iLike]: `%${q}%` } }] } : {};
    const { rows, count } = await User.findAndCountAll({
      where, include: [{ model: Organization, as: "organization" }], order: [["createdAt", "DESC"], ["email", "ASC"]],
      limit: pageSize, offset: (page - 1) * pageSize,
    });
    res.json({ items: rows.map(presentUser), total: count, page, pageSize });
  });

  // The planner changes a person's role or access; the last active planner stays one.
  router.patch("/users/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    const input = parseInput(userAccessUpdateSchema, req.body);
    const user = await sequelize.transaction(async (transaction) => {
      const user = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!user) throw NotFoundError("user");
      return userAccessChanger({ actor: req.user!, user, input, ip: req.ip ?? null, transaction });
    });
    await user.reload({ include: [{ model: Organization, as: "organization" }] });
    res.json(presentUser(user));
  });

  // What happened to a person's account, newest first: role changes, deactivation, sign-ins, password changes.
  router.get("/users/:id/events", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    const { limit } = parseInput(eventsQuery, req.query);
    if (!(await User.findByPk(id))) throw NotFoundError("user");
    const events = await Event.findAll({ where: { subjectType: "user", subjectId: id }, order: [["createdAt", "DESC"], ["id", "DESC"]], limit });
    const actorIds = [...new Set(events.map((e) => e.actorId).filter((x): x is string => !!x))];
    const names = new Map((actorIds.length ? await User.findAll({ where: { id: actorIds } }) : []).map((u) => [u.id, u.name]));
    const items: UserEventJson[] = events.map((e) => ({
      id: String(e.id), action: e.action, at: e.createdAt.toISOString(),
      actor: e.actorId ? { id: e.actorId, name: names.get(e.actorId) ?? "unknown" } : null, data: e.data ?? {},
    }));
    res.json({ items });
  });

  router.get("/organizations", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const orgs = await Organization.findAll({ order: [["kind", "ASC"], ["name", "ASC"]] });
    res.json({ items: orgs.map(presentOrganization) });
  });

  router.get("/invitations", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const open = await AuthToken.findAll({
      where: { kind: "invitation", usedAt: { [Op.is]: null }, expiresAt: { [Op.gt]: new Date() } },
      include: [{ model: Organization, as: "organization" }],
      order: [["expiresAt", "ASC"]], limit: 200,
    });
    res.json({ items: open.map((t) => presentInvitation(t, t.organization)) });
  });

  router.post("/invitations", requireUser, async (req, res) => {
    const input = parseInput(invitationCreateSchema, req.body);
    const actor = req.user!;
    const shop = await Organization.findByPk(actor.organizationId);
    authorize(actor, "invite", organizationPolicy, shop!);
    const { invitation, token, organization } = await sequelize.transaction((transaction) =>
      invitationCreator({ actor, input, ip: req.ip ?? null, transaction }),
    );
    mailer.send(
      invitationMail({
        to: invitation.email, link: `${config.appUrl}/invitation/${token}`, role: roleLabels[input.role].toLowerCase(),
        organizationName: organization.kind === "customer" ? organization.name : null, invitedBy: actor.name, expiresAt: invitation.expiresAt,
      }),
    );
    res.status(201).json(presentInvitation(invitation, organization));
  });

  // A fresh link and a fresh week; the old link stops working.
  router.post("/invitations/:id/resend", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    const actor = req.user!;
    const { invitation, token, organization } = await sequelize.transaction((transaction) => invitationResender({ actor, id, ip: req.ip ?? null, transaction }));
    mailer.send(
      invitationMail({
        to: invitation.email, link: `${config.appUrl}/invitation/${token}`, role: roleLabels[invitation.role!].toLowerCase(),
        organizationName: organization?.kind === "customer" ? organization.name : null, invitedBy: actor.name, expiresAt: invitation.expiresAt,
      }),
    );
    res.json(presentInvitation(invitation, organization));
  });

  router.delete("/invitations/:id", requireUser, async (req, res) => {
    requireRole(req.user!, "admin");
    const { id } = parseInput(idParam, req.params);
    await sequelize.transaction((transaction) => invitationWithdrawer({ actor: req.user!, id, ip: req.ip ?? null, transaction }));
    res.status(204).end();
  });

  return router;
}
