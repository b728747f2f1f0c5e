import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { passwordChangeSchema } from "../../../shared/schemas/auth";
import { useChangePassword } from "../../api/auth";
import { useServerErrors } from "../../lib/use-server-errors";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const passwordFormSchema = withPasswordConfirmation(passwordChangeSchema, "newPassword", "The two new passwords are not the same.");

export function PasswordForm() {
  const [saved, setSaved] = useState(false);
  const change = useChangePassword();
  const { register, handleSubmit, setError, reset, formState } = useForm({
    resolver: zodResolver(passwordFormSchema),
    defaultValues: { currentPassword: "", newPassword: "", confirmPassword: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["currentPassword", "newPassword"]);

  const onSubmit = handleSubmit(async ({ confirmPassword: _confirm, ...body }) => {
    setSaved(false);
    clearFormMessage();
    try {
      await change.mutateAsync(body);
      reset();
      setSaved(true);
    } catch (error) {
      // A wrong current password typically comes back as a field error on currentPassword.
      showServerError(error);
    }
  });

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="Current password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...register("currentPassword")} />
      <TextField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.newPassword?.message} {...register("newPassword")} />
      <TextField label="Repeat the new password" type="password" autoComplete="new-password" error={errors.confirmPassword?.message} {...register("confirmPassword")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Changing…">
        Change password
      </Button>
      {/* beside the button the person just pressed */}
      {saved && <StatusNote tone="ok" word="Changed" live="polite">Use the new password next time you sign in.</StatusNote>}
    </FormShell>
  );
}
