import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate } from "react-router-dom";
import { passwordSchema, profileSchema } from "../../../shared/schemas/auth";
import { invitationQueryOptions, useAcceptInvitation } from "../../api/auth";
import { ApiError } from "../../api/client";
import { paths } from "../../config/paths";
import { roleLabels } from "../../lib/roles";
import { Button, ButtonLink } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Loading } from "../../components/ui/spinner";
import { QueryError } from "../../components/query-error";
import { StatusNote } from "../../components/ui/status-note";
import { useServerErrors } from "../../lib/use-server-errors";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const acceptFormSchema = withPasswordConfirmation(profileSchema.extend({ password: passwordSchema }), "password");

const usedUp = "This invitation has expired or has already been used. Ask the planner who sent it for a new one.";

export function InvitationAccept({ token }: { token: string }) {
  const invitation = useQuery(invitationQueryOptions(token));

  if (invitation.isPending) return <Loading label="Checking the invitation…" />;
  if (invitation.isError) {
    if (invitation.error instanceof ApiError && invitation.error.status === 404) {
      return (
        <div className="space-y-4">
          <StatusNote tone="caution" word="Not valid">
            {usedUp}
          </StatusNote>
          <ButtonLink to={paths.signIn.href()}>Go to sign in</ButtonLink>
        </div>
      );
    }
    return <QueryError error={invitation.error} onRetry={() => invitation.refetch()} what="the invitation" />;
  }

  const { email, role, organizationName } = invitation.data;
  return (
    <div className="space-y-6">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md bg-flux-50 p-4">
        <dt className="font-semibold text-flux-700">Email</dt>
        <dd className="break-all font-mono">{email}</dd>
        <dt className="font-semibold text-flux-700">Role</dt>
        <dd>{roleLabels[role]}</dd>
        {organizationName && (
          <>
            <dt className="font-semibold text-flux-700">Organisation</dt>
            <dd>{organizationName}</dd>
          </>
        )}
      </dl>
      <AcceptForm token={token} />
    </div>
  );
}

function AcceptForm({ token }: { token: string }) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(acceptFormSchema),
    defaultValues: { name: "", password: "", confirmPassword: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["name", "password"]);

  const onSubmit = handleSubmit(async ({ name, password }) => {
    clearFormMessage();
    try {
      await accept.mutateAsync({ token, name, password });
      navigate(paths.home.href(), { replace: true });
    } catch (error) {
      showServerError(error, { 404: usedUp, 410: usedUp });
    }
  });

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register("name")} />
      <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register("password")} />
      <TextField label="Repeat the password" type="password" autoComplete="new-password" error={errors.confirmPassword?.message} {...register("confirmPassword")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Joining…">
        Accept and sign in
      </Button>
    </FormShell>
  );
}
