import type { Machine, RecheckOutcome, Role, UnitSystem } from "@ringdown/contracts";
import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { Notice } from "@/components/ui/page-header";
import { cn } from "@/lib/cn";
import { canEditProfile } from "../labels";
import { BacklashSection } from "./backlash-section";
import { CeilingsCard } from "./ceilings-card";
import { ModesSection } from "./modes-section";
import { RecheckNotice } from "./recheck-notice";
import { RecordingsSection } from "./recordings-section";
import { StabilitySection } from "./stability-section";
import { StiffnessSection } from "./stiffness-section";

export const PROFILE_TABS = [
  { id: "stiffness", label: "Stiffness and backlash" },
  { id: "modes", label: "Modes and ceilings" },
  { id: "recordings", label: "Recordings" },
  { id: "stability", label: "Stability lobes" },
] as const;
export type ProfileTab = (typeof PROFILE_TABS)[number]["id"];

type Message = { saved: string; outcome: RecheckOutcome | { recipesFlagged: number } };

/**
 * A machine's vibration profile: what the shop measured (stiffness, backlash, modes, recordings),
 * the ceilings recipes are held under, and the stability lobes that follow from them.
 * The tab lives in the address (`?tab=`), so a link can open any of them.
 */
export function VibrationProfile({ shopId, role, machine, system }: { shopId: string; role: Role; machine: Machine; system: UnitSystem }) {
  const [search, setSearch] = useSearchParams();
  const requested = search.get("tab");
  const tab: ProfileTab = PROFILE_TABS.some((t) => t.id === requested) ? (requested as ProfileTab) : "stiffness";
  const [message, setMessage] = useState<Message | null>(null);
  const mayEdit = canEditProfile(role) && !machine.deletedAt;
  const onOutcome = (saved: string, outcome: RecheckOutcome) => setMessage({ saved, outcome });

  return (
    <div className="flex flex-col gap-5">
      <div role="tablist" aria-label="Vibration profile" className="flex flex-wrap gap-1 border-b border-rule">
        {PROFILE_TABS.map((t) => (
          <button
            key={t.id}
            type="button"
            role="tab"
            id={`profile-tab-${t.id}`}
            aria-selected={tab === t.id}
            aria-controls={`profile-panel-${t.id}`}
            onClick={() => {
              setMessage(null);
              setSearch(
                (prev) => {
                  const next = new URLSearchParams(prev);
                  next.set("tab", t.id);
                  return next;
                },
                { replace: true },
              );
            }}
            className={cn(
              "-mb-px cursor-pointer border-b-2 px-3 py-2 text-sm font-medium",
              tab === t.id ? "border-brand text-ink" : "border-transparent text-muted hover:text-ink",
            )}
          >
            {t.label}
          </button>
        ))}
      </div>

      {!mayEdit && (
        <p className="text-sm text-muted">
          {machine.deletedAt
            ? "This machine is deleted: its profile is read-only until it is restored."
            : "Tooling managers and the owner enter readings, modes and ceilings; you can read everything and make recordings."}
        </p>
      )}
      {message &&
        ("changes" in message.outcome ? (
          <RecheckNotice saved={message.saved} outcome={message.outcome} system={system} onDismiss={() => setMessage(null)} />
        ) : (
          <Notice tone={message.outcome.recipesFlagged > 0 ? "near" : "ok"} onDismiss={() => setMessage(null)}>
            {message.saved}{" "}
            {message.outcome.recipesFlagged > 0
              ? `${message.outcome.recipesFlagged === 1 ? "1 recipe on this machine is" : `${message.outcome.recipesFlagged} recipes on this machine are`} flagged for re-check.`
              : "No recipe on this machine needed flagging."}
          </Notice>
        ))}

      <div role="tabpanel" id={`profile-panel-${tab}`} aria-labelledby={`profile-tab-${tab}`} className="flex flex-col gap-5">
        {tab === "stiffness" && (
          <>
            <StiffnessSection shopId={shopId} machine={machine} mayEdit={mayEdit} system={system} onOutcome={onOutcome} />
            <BacklashSection shopId={shopId} machine={machine} mayEdit={mayEdit} system={system} onOutcome={onOutcome} />
          </>
        )}
        {tab === "modes" && (
          <>
            <ModesSection shopId={shopId} machine={machine} mayEdit={mayEdit} system={system} onOutcome={onOutcome} />
            <CeilingsCard
              shopId={shopId}
              machine={machine}
              mayEdit={mayEdit}
              system={system}
              onSaved={(saved, recipesFlagged) => setMessage({ saved, outcome: { recipesFlagged } })}
            />
          </>
        )}
        {tab === "recordings" && <RecordingsSection shopId={shopId} machine={machine} mayDelete={mayEdit} system={system} />}
        {tab === "stability" && <StabilitySection shopId={shopId} machine={machine} system={system} />}
      </div>
    </div>
  );
}
