/** Colours and type of Ringdown's charts (the inspection-sheet palette). */
export const chart = {
  font: '11px "IBM Plex Sans", ui-sans-serif, system-ui, sans-serif',
  labelFont: '12px "IBM Plex Sans", ui-sans-serif, system-ui, sans-serif',
  ink: "#22252A",
  muted: "#6B6F76",
  grid: "rgba(218, 214, 204, 0.7)",
  tick: "#DAD6CC",
  brand: "#33407A",
  measured: "#1F6F8B",
  ok: "#2F7D5B",
  near: "#B7791F",
  limit: "#B83A2E",
  paper: "#F6F4EE",
} as const;

/** Axis settings shared by every chart: light grid, muted ticks, labelled with units. */
export function axis(label: string, extra: Record<string, unknown> = {}) {
  return {
    label,
    labelFont: chart.labelFont,
    labelSize: 22,
    font: chart.font,
    stroke: chart.muted,
    grid: { stroke: chart.grid, width: 1 },
    ticks: { stroke: chart.tick, width: 1, size: 4 },
    ...extra,
  };
}
