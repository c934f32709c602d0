import { useParams } from "react-router-dom";
import { MachineAssemblies } from "@/features/assemblies/components/machine-assemblies";
import { MachineDetail } from "@/features/machines/components/machine-detail";

export function MachineDetailRoute() {
  const { machineId = "" } = useParams();
  return (
    <div className="mx-auto max-w-7xl">
      <MachineDetail
        key={machineId}
        machineId={machineId}
        related={(machine) => (machine.deletedAt ? null : <MachineAssemblies machineId={machine.id} machineName={machine.name} />)}
      />
    </div>
  );
}
