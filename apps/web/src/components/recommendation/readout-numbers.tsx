import type { Recommendation, UnitSystem } from "@ringdown/machining";
import { cn } from "@/lib/cn";
import { readoutGroups, type ReadoutContext, type Shown } from "./readout";
import { Why } from "./why";

function Figure({ shown, large = false }: { shown: Shown; large?: boolean }) {
  return (
    <span className={cn("tabular whitespace-nowrap", large ? "text-lg" : "text-sm")}>
      <span className="font-medium text-ink">{shown.text}</span>
      {shown.unit && <span className="font-normal text-muted">{`\u202F${shown.unit}`}</span>}
    </span>
  );
}

/**
 * Every number of the recommendation, grouped, each with its unit and a "why" on hover, focus or
 * tap. The first group (speed and feed) is set larger: those are the numbers typed into the machine.
 */
export function ReadoutNumbers({
  rec,
  system,
  context,
  className,
}: {
  rec: Recommendation;
  system: UnitSystem;
  context?: ReadoutContext;
  className?: string;
}) {
  const groups = readoutGroups(rec, system, context);
  return (
    <div className={cn("grid gap-x-8 gap-y-5 sm:grid-cols-2", className)}>
      {groups.map((group, gi) => (
        <section key={group.title} aria-label={group.title} className={cn(gi === 0 && "sm:col-span-2")}>
          <h3 className="mb-1.5 text-xs font-medium tracking-wide text-muted uppercase">{group.title}</h3>
          <dl className={cn("grid gap-x-6", gi === 0 ? "grid-cols-1 sm:grid-cols-2" : "grid-cols-1")}>
            {group.rows.map((row) => (
              <div key={row.key} className="flex items-baseline justify-between gap-3 border-b border-rule/70 py-1.5">
                <dt className="min-w-0 text-sm text-ink">
                  {row.label}
                  {row.note && <span className="block text-xs text-muted">{row.note}</span>}
                </dt>
                <dd className="text-right">
                  {row.explain ? (
                    <Why label={row.label} explanation={rec.explain[row.explain]} limits={rec.limits}>
                      <Figure shown={row.shown} large={gi === 0} />
                    </Why>
                  ) : (
                    <Figure shown={row.shown} large={gi === 0} />
                  )}
                </dd>
              </div>
            ))}
          </dl>
        </section>
      ))}
    </div>
  );
}
