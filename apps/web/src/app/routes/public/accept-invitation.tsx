import { useParams } from "react-router-dom";
import { AuthLayout } from "@/features/auth/components/auth-layout";
import { AcceptInvitation } from "@/features/invitations/components/accept-invitation";
import { useDocumentTitle } from "@/lib/use-document-title";

export function AcceptInvitationRoute() {
  useDocumentTitle("Invitation");
  const { token = "" } = useParams();
  return (
    <AuthLayout title="Invitation to a shop">
      <AcceptInvitation token={token} />
    </AuthLayout>
  );
}
