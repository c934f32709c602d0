import type { Machine } from "@ringdown/contracts";
import type { ReactNode } from "react";
import { MeasureValue } from "@/components/ui/measure";
import { measures } from "@/components/ui/units";

function Figure({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 px-4 py-3">
      <dt className="text-xs text-muted">{label}</dt>
      <dd className="text-sm">{children}</dd>
    </div>
  );
}

/** The figures recipes are held to, at a glance. */
export function MachineKeyFigures({ machine: m }: { machine: Machine }) {
  const lowest = m.modes.length ? Math.min(...m.modes.map((x) => x.frequencyHz)) : null;
  return (
    <dl className="grid grid-cols-2 divide-rule rounded-lg border border-rule bg-surface sm:grid-cols-4 lg:grid-cols-8 lg:divide-x">
      <Figure label="Slowest speed"><MeasureValue value={m.spindle.minRpm} measure={measures.rpm} /></Figure>
      <Figure label="Fastest speed"><MeasureValue value={m.spindle.maxRpm} measure={measures.rpm} /></Figure>
      <Figure label="Rated power"><MeasureValue value={m.spindle.powerW} measure={measures.power} /></Figure>
      <Figure label="Stiffness X"><MeasureValue value={m.axes.x.stiffnessNPerMm} measure={measures.stiffness} /></Figure>
      <Figure label="Stiffness Y"><MeasureValue value={m.axes.y.stiffnessNPerMm} measure={measures.stiffness} /></Figure>
      <Figure label="Stiffness Z"><MeasureValue value={m.axes.z.stiffnessNPerMm} measure={measures.stiffness} /></Figure>
      <Figure label={`Modes (${m.modes.length})`}>
        {lowest === null ? <span className="text-muted">none recorded</span> : <>lowest <MeasureValue value={lowest} measure={measures.frequency} /></>}
      </Figure>
      <Figure label="Deflection ceiling"><MeasureValue value={m.deflectionCeilingMm} measure={measures.length} /></Figure>
    </dl>
  );
}
