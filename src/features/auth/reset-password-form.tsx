import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { passwordSchema } from "../../../shared/schemas/auth";
import { useConfirmPasswordReset } from "../../api/auth";
import { paths } from "../../config/paths";
import { ButtonLink, Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { useServerErrors } from "../../lib/use-server-errors";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const resetFormSchema = withPasswordConfirmation(z.object({ password: passwordSchema }), "password");

const expiredLink = "This reset link has expired or was already used. Ask for a new one.";

export function ResetPasswordForm({ token }: { token: string }) {
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
      // A token problem arrives as a field error on "token", which is not on this form.
      showServerError(error, { 404: expiredLink, 410: expiredLink });
    }
  });

  if (done) {
    return (
      <div className="space-y-4">
        <StatusNote tone="ok" word="Password changed">
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
