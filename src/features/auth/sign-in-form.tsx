import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, useNavigate } from "react-router-dom";
import { loginSchema } from "../../../shared/schemas/auth";
import { useLogin } from "../../api/auth";
import { paths } from "../../config/paths";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { useServerErrors } from "../../lib/use-server-errors";
import { FormShell } from "../../components/ui/form-shell";

/** redirectTo: a same-origin path already checked by safeRedirect, or null for the role home. */
export function SignInForm({ redirectTo }: { redirectTo: string | null }) {
  const navigate = useNavigate();
  const login = useLogin();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(loginSchema),
    defaultValues: { email: "", password: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["email", "password"]);

  const onSubmit = handleSubmit(async (values) => {
    clearFormMessage();
    try {
      await login.mutateAsync(values);
      // Every role's home is "/"; the page shows that role's work.
      navigate(redirectTo ?? paths.home.href(), { replace: true });
    } catch (error) {
      showServerError(error, {
        401: "That email and password do not match an account.",
        429: "Too many sign-in attempts. Wait a minute and try again.",
      });
    }
  });

  const { errors, isSubmitting } = formState;
  return (
    <FormShell onSubmit={onSubmit} message={formMessage}>
      <TextField label="Email" type="email" autoComplete="username" inputMode="email" error={errors.email?.message} {...register("email")} />
      <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...register("password")} />
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Button type="submit" pending={isSubmitting} pendingLabel="Signing in…">
          Sign in
        </Button>
        <Link to={paths.forgotPassword.href()} className="inline-flex min-h-touch items-center font-semibold text-flux-700 underline underline-offset-4">
          Forgot password?
        </Link>
      </div>
    </FormShell>
  );
}
