import { Router } from "express";
import { Op, type WhereOptions } from "sequelize";
import { z } from "zod";
import { invitationCreateSchema } from "../../shared/schemas/auth";
import type { AppDeps } from "../deps";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { AuthToken, Organization, User } from "../models";
import { organizationPolicy } from "../policies/organization";
import { authorize, requireRole } from "../policies/utils";
import { presentInvitation } from "../presenters/invitation";
import { presentOrganization } from "../presenters/organization";
import { presentUser } from "../presenters/user";
import { invitationCreator } from "../services/invitationCreator";
import { invitationMail } from "../services/mail-texts";
import { roleLabels } from "../../shared/schemas/roles-labels";

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

  return router;
}
