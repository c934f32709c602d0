/**
 * Defaults by machine kind are estimates, not measurements: the machine stores the dot paths of
 * every defaulted value in `estimatedFields` ("spindle.maxRpm", "axes.y.stiffnessNPerMm", "modes.0"
 * for a whole mode). A value stops being an estimate when someone changes it or marks it checked.
 */

function within(path: string, ancestor: string): boolean {
  return path === ancestor || path.startsWith(`${ancestor}.`);
}

/** Whether the value at `path` is (part of) an estimate. */
export function isEstimated(estimated: readonly string[], path: string): boolean {
  return estimated.some((e) => within(path, e));
}

/** How many estimates lie at or under `path` (e.g. "axes.x"). */
export function estimatesUnder(estimated: readonly string[], path: string): number {
  return estimated.filter((e) => within(e, path) || within(path, e)).length;
}

/**
 * The estimates left once the value at `path` has been set by a person: the entry for it, any
 * entry covering it (a whole mode) and any entry under it go.
 */
export function clearEstimate(estimated: readonly string[], path: string): string[] {
  return estimated.filter((e) => !within(path, e) && !within(e, path));
}

/**
 * After removing item `index` of the list at `listPath`, its estimates go and those of later
 * items move up one place, so "modes.2" becomes "modes.1".
 */
export function afterRemoval(estimated: readonly string[], listPath: string, index: number): string[] {
  const prefix = `${listPath}.`;
  const out: string[] = [];
  for (const e of estimated) {
    if (!e.startsWith(prefix)) {
      out.push(e);
      continue;
    }
    const [head, ...rest] = e.slice(prefix.length).split(".");
    const i = Number(head);
    if (!Number.isInteger(i)) {
      out.push(e);
    } else if (i > index) {
      out.push([`${listPath}.${i - 1}`, ...rest].join("."));
    } else if (i < index) {
      out.push(e);
    }
  }
  return out;
}
