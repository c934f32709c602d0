import { roleLabels, type Me } from "@ringdown/contracts";
import { Check, ChevronsUpDown, Plus } from "lucide-react";
import { useId, useState } from "react";
import { Popover } from "@/components/ui/popover";
import { Spinner } from "@/components/ui/spinner";
import { activeMembership } from "@/lib/auth";
import { cn } from "@/lib/cn";
import { useSwitchShop } from "../api/update-me";
import { NewShopDialog } from "./new-shop-dialog";

/** The active shop at the top of the rail; opens the list of the person's shops and "New shop…". */
export function ShopSwitcher({ me }: { me: Me }) {
  const listLabelId = useId();
  const [creating, setCreating] = useState(false);
  const switchShop = useSwitchShop();
  const active = activeMembership(me);
  const shops = [...me.memberships].sort((a, b) => a.shopName.localeCompare(b.shopName));

  return (
    <>
      <Popover
        panelClassName="inset-x-0 min-w-56"
        trigger={(props) => (
          <button
            {...props}
            type="button"
            aria-haspopup="true"
            className="flex w-full cursor-pointer items-center gap-2 rounded-md border border-rule bg-surface px-3 py-2 text-left hover:border-brand/50"
          >
            <span className="min-w-0 flex-1">
              <span className="block text-[0.6875rem] font-medium uppercase tracking-wide text-muted">Shop</span>
              <span className="line-clamp-2 block text-sm font-semibold break-words text-ink">
                {active?.shopName ?? "No shop selected"}
              </span>
              {active && <span className="block text-xs text-muted">{roleLabels[active.role]}</span>}
            </span>
            {switchShop.isPending ? <Spinner className="text-muted" /> : <ChevronsUpDown className="size-4 text-muted" aria-hidden />}
          </button>
        )}
      >
        {(close) => (
          <div>
            <p id={listLabelId} className="px-2 pt-1 pb-1.5 text-xs font-medium text-muted">
              Your shops
            </p>
            <ul aria-labelledby={listLabelId} className="max-h-72 overflow-y-auto">
              {shops.map((m) => {
                const isActive = m.shopId === me.activeShopId;
                return (
                  <li key={m.shopId}>
                    <button
                      type="button"
                      aria-current={isActive ? "true" : undefined}
                      disabled={switchShop.isPending}
                      onClick={() => {
                        if (isActive) return close();
                        switchShop.mutate(m.shopId, { onSuccess: close });
                      }}
                      className={cn(
                        "flex w-full cursor-pointer items-center gap-2 rounded-md px-2 py-1.5 text-left text-sm hover:bg-paper",
                        isActive && "font-medium text-brand",
                      )}
                    >
                      <span className="flex size-4 shrink-0 items-center justify-center">
                        {isActive && <Check className="size-4" aria-hidden />}
                      </span>
                      <span className="min-w-0 flex-1">
                        <span className="block truncate">{m.shopName}</span>
                        <span className="block text-xs font-normal text-muted">{roleLabels[m.role]}</span>
                      </span>
                    </button>
                  </li>
                );
              })}
            </ul>
            {switchShop.isError && (
              <p role="alert" className="px-2 py-1.5 text-xs text-limit">
                Could not switch shop: {switchShop.error.message}
              </p>
            )}
            <div className="mt-1 border-t border-rule pt-1">
              <button
                type="button"
                onClick={() => {
                  close();
                  setCreating(true);
                }}
                className="flex w-full cursor-pointer items-center gap-2 rounded-md px-2 py-1.5 text-left text-sm text-ink hover:bg-paper"
              >
                <Plus className="size-4 text-muted" aria-hidden />
                New shop…
              </button>
            </div>
          </div>
        )}
      </Popover>
      <NewShopDialog open={creating} onClose={() => setCreating(false)} />
    </>
  );
}
