import { Outlet, ScrollRestoration } from "react-router-dom";

export function RootRoute() {
  return (
    <>
      <Outlet />
      <ScrollRestoration />
    </>
  );
}
