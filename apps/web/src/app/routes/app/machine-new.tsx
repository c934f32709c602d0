import { MachineNew } from "@/features/machines/components/machine-new";

export function MachineNewRoute() {
  return (
    <div className="mx-auto max-w-7xl">
      <MachineNew />
    </div>
  );
}
