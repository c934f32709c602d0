import { ChangeHistoryPage } from "@/features/audit/components/change-history-page";

export function TeamHistoryRoute() {
  return <ChangeHistoryPage />;
}
