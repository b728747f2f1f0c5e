import { Link } from "react-router-dom";
import { paths } from "../config/paths";
import { PanelBoundary } from "../components/error-boundary";
import { AuthCard } from "../features/auth/auth-card";
import { RegisterForm } from "../features/auth/register-form";
import { makeLoader as makeSignInLoader } from "./sign-in";

// Same rule as sign-in: a signed-in visitor has nothing to register.
export const makeLoader = makeSignInLoader;

export function Component() {
  return (
    <AuthCard
      title="Create a customer account"
      lead="Save shield designs, request quotes, order, and download the certificates of your lots."
      footer={
        <p>
          Already have an account?{" "}
          <Link to={paths.signIn.href()} className="font-semibold text-flux-800 underline underline-offset-4">
            Sign in
          </Link>
        </p>
      }
    >
      <PanelBoundary name="the registration form">
        <RegisterForm />
      </PanelBoundary>
    </AuthCard>
  );
}
