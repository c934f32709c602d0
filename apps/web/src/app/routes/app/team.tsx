import { TeamPage } from "@/features/team/components/team-page";

export function TeamRoute() {
  return <TeamPage />;
}
