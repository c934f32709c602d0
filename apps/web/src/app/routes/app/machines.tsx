import { MachinesPage } from "@/features/machines/components/machines-page";

export function MachinesRoute() {
  return <MachinesPage />;
}
