import type { Me, UnitSystem } from "@ringdown/contracts";
import { ChevronsUpDown, LogOut } from "lucide-react";
import { Popover } from "@/components/ui/popover";
import { Spinner } from "@/components/ui/spinner";
import { useLogout } from "@/lib/auth";
import { useSetUnitSystem } from "../api/update-me";

const unitChoices: Array<{ value: UnitSystem; label: string; example: string }> = [
  { value: "metric", label: "Metric", example: "mm, m/min, kW" },
  { value: "imperial", label: "Imperial", example: "in, ft/min, hp" },
];

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  const letters = parts.length > 1 ? [parts[0], parts[parts.length - 1]] : parts;
  return letters.map((p) => p?.[0]?.toUpperCase() ?? "").join("") || "?";
}

/** The signed-in person: unit preference and sign out. */
export function UserMenu({ me }: { me: Me }) {
  const setUnitSystem = useSetUnitSystem();
  const logout = useLogout();

  return (
    <Popover
      placement="above"
      panelClassName="inset-x-0 min-w-56"
      trigger={(props) => (
        <button
          {...props}
          type="button"
          className="flex w-full cursor-pointer items-center gap-2.5 rounded-md px-2 py-2 text-left hover:bg-surface"
        >
          <span
            aria-hidden
            className="flex size-8 shrink-0 items-center justify-center rounded-full bg-brand text-xs font-semibold text-white"
          >
            {initials(me.user.name)}
          </span>
          <span className="min-w-0 flex-1">
            <span className="sr-only">Account: </span>
            <span className="block truncate text-sm font-medium text-ink">{me.user.name}</span>
            <span className="block truncate text-xs text-muted">{me.user.email}</span>
          </span>
          <ChevronsUpDown className="size-4 shrink-0 text-muted" aria-hidden />
        </button>
      )}
    >
      {() => (
        <div className="flex flex-col gap-1">
          <fieldset className="px-2 pt-1 pb-2" disabled={setUnitSystem.isPending}>
            <legend className="mb-1.5 flex items-center gap-2 text-xs font-medium text-muted">
              Units {setUnitSystem.isPending && <Spinner className="size-3" />}
            </legend>
            <div className="flex flex-col gap-1">
              {unitChoices.map((choice) => (
                <label key={choice.value} className="flex cursor-pointer items-center gap-2 rounded-md px-1 py-1 text-sm hover:bg-paper">
                  <input
                    type="radio"
                    name="unit-system"
                    value={choice.value}
                    checked={me.user.unitSystem === choice.value}
                    onChange={() => setUnitSystem.mutate(choice.value)}
                    className="size-4 accent-brand"
                  />
                  <span>{choice.label}</span>
                  <span className="text-xs text-muted">{choice.example}</span>
                </label>
              ))}
            </div>
            {setUnitSystem.isError && (
              <p role="alert" className="mt-1 text-xs text-limit">
                Could not save the preference: {setUnitSystem.error.message}
              </p>
            )}
          </fieldset>
          <div className="border-t border-rule pt-1">
            <button
              type="button"
              disabled={logout.isPending}
              onClick={() => logout.mutate()}
              className="flex w-full cursor-pointer items-center gap-2 rounded-md px-2 py-1.5 text-left text-sm hover:bg-paper"
            >
              {logout.isPending ? <Spinner className="text-muted" /> : <LogOut className="size-4 text-muted" aria-hidden />}
              Sign out
            </button>
            {logout.isError && (
              <p role="alert" className="px-2 py-1 text-xs text-limit">
                Could not sign out: {logout.error.message}
              </p>
            )}
          </div>
        </div>
      )}
    </Popover>
  );
}
