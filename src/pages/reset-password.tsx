import { useParams } from "react-router-dom";
import { PanelBoundary } from "../components/error-boundary";
import { AuthCard } from "../features/auth/auth-card";
import { ResetPasswordForm } from "../features/auth/reset-password-form";

export function Component() {
  const { token = "" } = useParams();
  return (
    <AuthCard title="Choose a new password">
      <PanelBoundary name="the new password form">
        <ResetPasswordForm token={token} />
      </PanelBoundary>
    </AuthCard>
  );
}
