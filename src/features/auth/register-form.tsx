import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useNavigate } from "react-router-dom";
import { registerSchema } from "../../../shared/schemas/auth";
import { useRegister } from "../../api/auth";
import { paths } from "../../config/paths";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { useServerErrors } from "../../lib/use-server-errors";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const registerFormSchema = withPasswordConfirmation(registerSchema, "password");

export function RegisterForm() {
  const navigate = useNavigate();
  const registration = useRegister();
  const [mailedTo, setMailedTo] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(registerFormSchema),
    defaultValues: { name: "", email: "", organization: "", password: "", confirmPassword: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["name", "email", "organization", "password"]);

  const onSubmit = handleSubmit(async ({ confirmPassword: _confirm, ...body }) => {
    clearFormMessage();
    try {
      const { user, email } = await registration.mutateAsync(body);
      if (user) navigate(paths.home.href(), { replace: true });
      else setMailedTo(email);
    } catch (error) {
      showServerError(error);
    }
  });

  // The server does not say whether the address already had an account; only the session tells
  // whether this browser is signed in. When it is not, the mail explains (to the address's owner).
  if (mailedTo) {
    return (
      <div className="space-y-4" data-testid="registration-mailed">
        <StatusNote tone="info" word="Check your mail" live="polite">
          You are not signed in yet. A message has gone to <span className="break-all font-mono">{mailedTo}</span>: if the address already has a Fluxwright account, it says how to sign in or choose a new password.
        </StatusNote>
        <p className="flex flex-wrap gap-x-4 gap-y-2">
          <Link to={paths.signIn.href()} className="font-semibold text-flux-800 underline underline-offset-4">
            Sign in
          </Link>
          <Link to={paths.forgotPassword.href()} className="font-semibold text-flux-800 underline underline-offset-4">
            Choose a new password
          </Link>
        </p>
      </div>
    );
  }

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register("name")} />
      <TextField label="Work email" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register("email")} />
      <TextField label="Organisation" autoComplete="organization" hint="The company or laboratory the shields are for." error={errors.organization?.message} {...register("organization")} />
      <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register("password")} />
      <TextField label="Repeat the password" type="password" autoComplete="new-password" error={errors.confirmPassword?.message} {...register("confirmPassword")} />
      <Button type="submit" pending={isSubmitting} pendingLabel="Creating the account…">
        Create account
      </Button>
    </FormShell>
  );
}
