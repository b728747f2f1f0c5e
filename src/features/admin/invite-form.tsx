import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { invitationCreateSchema, roles, type Role } from "../../../shared/schemas/auth";
import { useCreateInvitation } from "../../api/invitations";
import { organizationsQueryOptions } from "../../api/organizations";
import { formatDateTime } from "../../lib/format";
import { roleLabels } from "../../lib/roles";
import { useServerErrors } from "../../lib/use-server-errors";
import { Button } from "../../components/ui/button";
import { SelectField, TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { FormShell } from "../../components/ui/form-shell";

// Customers belong to a customer organisation; staff join the shop, which the server assigns.
const inviteFormSchema = invitationCreateSchema.superRefine((values, context) => {
  if (values.role === "customer" && !values.organizationId) {
    context.addIssue({ code: "custom", path: ["organizationId"], message: "Choose the customer's organisation." });
  }
});

const roleHints: Record<Role, string> = {
  customer: "configures shields, orders, downloads certificates",
  operator: "scans travelers at each shop step",
  qa: "measures lots, decides them, issues certificates",
  admin: "releases orders, plans furnace runs, manages users",
};

export function InviteForm() {
  const [sent, setSent] = useState<{ email: string; expiresAt: string } | null>(null);
  const organizations = useQuery(organizationsQueryOptions);
  const invite = useCreateInvitation();
  const { register, handleSubmit, setError, reset, watch, formState } = useForm({
    resolver: zodResolver(inviteFormSchema),
    defaultValues: { email: "", role: "customer" as Role, organizationId: undefined },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["email", "role", "organizationId"]);
  const role = watch("role");
  const customerOrganizations = (organizations.data?.items ?? []).filter((organization) => organization.kind === "customer");

  const onSubmit = handleSubmit(async (values) => {
    clearFormMessage();
    setSent(null);
    try {
      const body = values.role === "customer" ? values : { email: values.email, role: values.role };
      const created = await invite.mutateAsync(body);
      setSent({ email: created.email, expiresAt: created.expiresAt });
      reset({ email: "", role: values.role, organizationId: values.role === "customer" ? values.organizationId : undefined });
    } catch (error) {
      showServerError(error, { 409: "That email address already has an account." });
    }
  });

  const { errors, isSubmitting } = formState;
  return (
    <Panel title="Invite someone">
      <FormShell onSubmit={onSubmit} message={formMessage}>
        <TextField label="Email" type="email" autoComplete="off" inputMode="email" error={errors.email?.message} {...register("email")} />
        <SelectField label="Role" hint={roleHints[role]} error={errors.role?.message} {...register("role")}>
          {roles.map((value) => (
            <option key={value} value={value}>
              {roleLabels[value]}
            </option>
          ))}
        </SelectField>
        {role === "customer" && (
          <SelectField
            label="Customer organisation"
            error={errors.organizationId?.message}
            hint={organizations.isError ? "The organisations could not be loaded; reload the page to try again." : undefined}
            disabled={organizations.isPending}
            {...register("organizationId", { setValueAs: (value: string) => (value ? value : undefined) })}
          >
            <option value="">{organizations.isPending ? "Loading organisations…" : "Choose an organisation"}</option>
            {customerOrganizations.map((organization) => (
              <option key={organization.id} value={organization.id}>
                {organization.name}
              </option>
            ))}
          </SelectField>
        )}
        <Button type="submit" pending={isSubmitting} pendingLabel="Sending…">
          Send invitation
        </Button>
        {sent && (
          <StatusNote tone="ok" word="Invitation sent" live="polite">
            to <span className="break-all font-mono">{sent.email}</span>, valid until <span className="font-mono">{formatDateTime(sent.expiresAt)}</span>. It is listed under pending invitations.
          </StatusNote>
        )}
      </FormShell>
    </Panel>
  );
}
