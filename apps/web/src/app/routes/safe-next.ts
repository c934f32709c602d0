/**
 * Where to go after signing in: the `next` query parameter when it is a path on
 * this site (never another origin), else the planner.
 */
export function safeNext(search: string): string {
  const next = new URLSearchParams(search).get("next");
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return "/planner";
  if (next.startsWith("/sign-in") || next.startsWith("/sign-up")) return "/planner";
  return next;
}
