import type { Me } from "@ringdown/contracts";
import { Menu, X } from "lucide-react";
import { useEffect, useState, type ReactNode } from "react";
import { NavLink, useLocation } from "react-router-dom";
import { Wordmark } from "@/components/ui/wordmark";
import { activeMembership } from "@/lib/auth";
import { cn } from "@/lib/cn";
import { areas } from "../areas";
import { ShopSwitcher } from "./shop-switcher";
import { UserMenu } from "./user-menu";

/**
 * The signed-in frame: a narrow left rail (shop switcher, main areas, account)
 * beside the page. Below the md breakpoint the rail becomes a drawer opened
 * from a top bar.
 */
export function AppShell({ me, children }: { me: Me; children: ReactNode }) {
  const [drawerOpen, setDrawerOpen] = useState(false);
  const { pathname } = useLocation();
  const active = activeMembership(me);

  useEffect(() => setDrawerOpen(false), [pathname]);
  useEffect(() => {
    if (!drawerOpen) return;
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === "Escape" && !event.defaultPrevented) setDrawerOpen(false);
    };
    document.addEventListener("keydown", onKeyDown);
    return () => document.removeEventListener("keydown", onKeyDown);
  }, [drawerOpen]);

  return (
    <div className="min-h-dvh md:grid md:grid-cols-[15rem_minmax(0,1fr)]">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-[60] focus:rounded-md focus:bg-surface focus:px-3 focus:py-2 focus:text-sm"
      >
        Skip to content
      </a>

      <header className="sticky top-0 z-30 flex h-14 items-center gap-3 border-b border-rule bg-paper px-3 md:hidden">
        <button
          type="button"
          aria-expanded={drawerOpen}
          aria-controls="app-rail"
          onClick={() => setDrawerOpen((o) => !o)}
          className="flex size-10 cursor-pointer items-center justify-center rounded-md text-ink hover:bg-ink/5"
        >
          {drawerOpen ? <X className="size-5" aria-hidden /> : <Menu className="size-5" aria-hidden />}
          <span className="sr-only">Menu</span>
        </button>
        <Wordmark />
        <span className="ml-auto min-w-0 truncate text-sm text-muted">{active?.shopName}</span>
      </header>

      {drawerOpen && (
        <div aria-hidden className="fixed inset-x-0 top-14 bottom-0 z-30 bg-ink/30 md:hidden" onClick={() => setDrawerOpen(false)} />
      )}

      <div
        id="app-rail"
        className={cn(
          "flex-col gap-5 border-r border-rule bg-paper px-3 py-4",
          "max-md:fixed max-md:top-14 max-md:bottom-0 max-md:left-0 max-md:z-40 max-md:w-72 max-md:max-w-[85vw] max-md:overflow-y-auto max-md:shadow-xl",
          "md:sticky md:top-0 md:flex md:h-dvh",
          drawerOpen ? "flex" : "hidden",
        )}
      >
        <div className="hidden px-2 pt-1 md:block">
          <Wordmark className="text-lg" />
        </div>
        <ShopSwitcher me={me} />
        <nav aria-label="Main areas" className="flex-1">
          <ul className="flex flex-col gap-0.5">
            {areas.filter((area) => !area.roles || (active !== undefined && area.roles.includes(active.role))).map((area) => (
              <li key={area.key}>
                <NavLink
                  to={area.path}
                  className={({ isActive }) =>
                    cn(
                      "relative flex items-center gap-2.5 rounded-md px-3 py-2 text-sm",
                      isActive
                        ? "bg-surface font-medium text-brand shadow-[inset_3px_0_0_0_var(--color-brand)]"
                        : "text-ink hover:bg-ink/5",
                    )
                  }
                >
                  <area.icon className="size-4 shrink-0" aria-hidden />
                  {area.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="border-t border-rule pt-3">
          <UserMenu me={me} />
        </div>
      </div>

      <main id="main" tabIndex={-1} className="min-w-0 px-4 py-6 outline-none md:px-10 md:py-10">
        {children}
      </main>
    </div>
  );
}
