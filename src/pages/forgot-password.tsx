import { Link } from "react-router-dom";
import { paths } from "../config/paths";
import { PanelBoundary } from "../components/error-boundary";
import { AuthCard } from "../features/auth/auth-card";
import { ForgotPasswordForm } from "../features/auth/forgot-password-form";

export function Component() {
  return (
    <AuthCard
      title="Forgot your password?"
      lead="Enter the email you sign in with and we will mail a link to choose a new password."
      footer={
        <p>
          <Link to={paths.signIn.href()} className="font-semibold text-flux-800 underline underline-offset-4">
            Back to sign in
          </Link>
        </p>
      }
    >
      <PanelBoundary name="the reset request form">
        <ForgotPasswordForm />
      </PanelBoundary>
    </AuthCard>
  );
}
