import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { passwordResetRequestSchema } from "../../../shared/schemas/auth";
import { useRequestPasswordReset } from "../../api/auth";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { useServerErrors } from "../../lib/use-server-errors";
import { FormShell } from "../../components/ui/form-shell";

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const requestReset = useRequestPasswordReset();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["email"]);

  const onSubmit = handleSubmit(async (values) => {
    clearFormMessage();
    try {
      await requestReset.mutateAsync(values);
      setSentTo(values.email);
    } catch (error) {
      showServerError(error);
    }
  });

  // The same answer whether or not the account exists, so the page cannot be used to probe emails.
  if (sentTo) {
    return (
      <StatusNote tone="ok" word="Sent" live="polite">
        If an account exists for <span className="font-mono">{sentTo}</span>, a mail is on its way with a link to choose
        a new password. The link works once and expires.
      </StatusNote>
    );
  }

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="Email" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register("email")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Sending…">
        Send the reset link
      </Button>
    </FormShell>
  );
}
