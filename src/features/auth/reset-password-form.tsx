import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { passwordSchema } from "../../../shared/schemas/auth";
import { resetLinkQueryOptions, useConfirmPasswordReset } from "../../api/auth";
import { ApiError } from "../../api/client";
import { paths } from "../../config/paths";
import { ButtonLink, Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Loading } from "../../components/ui/spinner";
import { QueryError } from "../../components/query-error";
import { StatusNote } from "../../components/ui/status-note";
import { useServerErrors } from "../../lib/use-server-errors";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const resetFormSchema = withPasswordConfirmation(z.object({ password: passwordSchema }), "password");

const expiredLink = "This reset link has expired or was already used. Ask for a new one.";

/** Says whether the link still works before anything is typed; a spent or expired link gets no form. */
export function ResetPasswordForm({ token }: { token: string }) {
  const link = useQuery(resetLinkQueryOptions(token));
  const [spent, setSpent] = useState(false);
  if (link.isPending) return <Loading label="Checking the link…" />;
  if (spent || (link.isError && link.error instanceof ApiError && (link.error.status === 404 || link.error.status === 410))) return <LinkNotValid />;
  if (link.isError) return <QueryError error={link.error} onRetry={() => void link.refetch()} what="the reset link" />;
  return <NewPasswordForm token={token} onSpent={() => setSpent(true)} />;
}

function LinkNotValid() {
  return (
    <div className="space-y-4" data-testid="reset-link-invalid">
      <StatusNote tone="caution" word="Link not valid">
        {expiredLink} Each link works once and for an hour.
      </StatusNote>
      <ButtonLink to={paths.forgotPassword.href()} variant="primary">
        Ask for a new link
      </ButtonLink>
    </div>
  );
}

function NewPasswordForm({ token, onSpent }: { token: string; onSpent: () => void }) {
  const [done, setDone] = useState(false);
  const confirmReset = useConfirmPasswordReset();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(resetFormSchema),
    defaultValues: { password: "", confirmPassword: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["password"]);

  const onSubmit = handleSubmit(async ({ password }) => {
    clearFormMessage();
    try {
      await confirmReset.mutateAsync({ token, password });
      setDone(true);
    } catch (error) {
      // the link was spent or ran out while the form was open
      if (error instanceof ApiError && (error.status === 404 || error.status === 410)) return onSpent();
      showServerError(error);
    }
  });

  if (done) {
    return (
      <div className="space-y-4">
        <StatusNote tone="ok" word="Password changed" live="polite">
          Sign in with the new password.
        </StatusNote>
        <ButtonLink to={paths.signIn.href()} variant="primary">
          Sign in
        </ButtonLink>
      </div>
    );
  }

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register("password")} />
      <TextField label="Repeat the new password" type="password" autoComplete="new-password" error={errors.confirmPassword?.message} {...register("confirmPassword")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Saving…">
        Set the new password
      </Button>
    </FormShell>
  );
}
