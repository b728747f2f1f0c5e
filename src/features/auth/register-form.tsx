import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate } from "react-router-dom";
import { registerSchema } from "../../../shared/schemas/auth";
import { useRegister } from "../../api/auth";
import { paths } from "../../config/paths";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { useServerErrors } from "../../lib/use-server-errors";
import { withPasswordConfirmation } from "../../lib/password-confirmation";
import { FormShell } from "../../components/ui/form-shell";

const registerFormSchema = withPasswordConfirmation(registerSchema, "password");

export function RegisterForm() {
  const navigate = useNavigate();
  const registration = useRegister();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(registerFormSchema),
    defaultValues: { name: "", email: "", organization: "", password: "", confirmPassword: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["name", "email", "organization", "password"]);

  const onSubmit = handleSubmit(async ({ confirmPassword: _confirm, ...body }) => {
    clearFormMessage();
    try {
      await registration.mutateAsync(body);
      navigate(paths.home.href(), { replace: true });
    } catch (error) {
      showServerError(error, { 409: "An account with that email already exists. Sign in or reset the password." });
    }
  });

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
