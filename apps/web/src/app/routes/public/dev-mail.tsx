import { CapturedMail } from "@/features/invitations/components/captured-mail";
import { useDocumentTitle } from "@/lib/use-document-title";

export function DevMailRoute() {
  useDocumentTitle("Captured e-mail");
  return <CapturedMail />;
}
