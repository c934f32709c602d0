import type { UnitSystem } from "@ringdown/contracts";
import { MeasureValue } from "@/components/ui/measure";
import { LoadingState } from "@/components/ui/spinner";
import { measures } from "@/components/ui/units";
import { LoadError } from "@/components/ui/load-error";
import { formatNumber } from "@/lib/format";
import { useRecipeCutLogs } from "../api/get-recipe-cut-logs";
import { OutcomeBadge } from "./outcome-badge";

const when = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });

/** The cuts logged against one recipe: outcome, actual numbers, note and photos. */
export function RecipeCutLogs({ shopId, recipeId, system }: { shopId: string; recipeId: string; system: UnitSystem }) {
  const logs = useRecipeCutLogs(shopId, recipeId);
  if (logs.isPending) return <LoadingState label="Loading the cut log…" />;
  if (logs.isError)
    return (
      <LoadError onRetry={() => void logs.refetch()}>Cannot load the cut log: {logs.error.message}</LoadError>
    );
  if (logs.data.items.length === 0) {
    return <p className="text-sm text-muted">No cuts logged yet. After a test cut, log how it went: it is what proves the recipe on its machine.</p>;
  }
  return (
    <div className="flex flex-col gap-2">
      <p className="text-xs text-muted">
        {formatNumber(logs.data.total)} {logs.data.total === 1 ? "cut" : "cuts"} logged
        {logs.data.items.length < logs.data.total ? `, latest ${formatNumber(logs.data.items.length)} shown` : ""}.
      </p>
      <ol aria-label="Cut log" className="flex flex-col divide-y divide-rule/70">
        {logs.data.items.map((log) => (
          <li key={log.id} className="flex flex-col gap-1.5 py-3">
            <div className="flex flex-wrap items-center gap-2">
              <OutcomeBadge outcome={log.outcome} />
              <span className="text-xs text-muted">
                {log.userName} · <time dateTime={log.createdAt}>{when.format(new Date(log.createdAt))}</time> · revision {log.recipeRevision}
              </span>
            </div>
            <p className="tabular text-sm">
              <MeasureValue value={Math.round(log.actualRpm)} measure={measures.rpm} system={system} /> ·{" "}
              <MeasureValue value={log.actualFeedMmPerMin} measure={measures.feedRate} system={system} /> · ap{" "}
              <MeasureValue value={log.axialDepthMm} measure={measures.length} system={system} /> · ae{" "}
              <MeasureValue value={log.radialDepthMm} measure={measures.length} system={system} />
              {log.feedOverridePct !== null && (
                <>
                  {" "}
                  · feed override <MeasureValue value={log.feedOverridePct} measure={measures.percent} system={system} />
                </>
              )}
            </p>
            {log.note && <p className="text-sm text-ink">{log.note}</p>}
            {log.photos.length > 0 && (
              <ul aria-label="Photos" className="flex flex-wrap gap-2">
                {log.photos.map((photo, i) => (
                  <li key={photo.id}>
                    <a href={photo.url} target="_blank" rel="noreferrer" className="block overflow-hidden rounded-md border border-rule">
                      <img
                        src={photo.url}
                        alt={`Photo ${i + 1} of the cut logged by ${log.userName}`}
                        loading="lazy"
                        className="size-20 object-cover"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ol>
    </div>
  );
}
