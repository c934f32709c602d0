import { useMemo, type ComponentType } from "react";
import { createBrowserRouter, Navigate, RouterProvider, type RouteObject } from "react-router-dom";
import { LoadingState } from "@/components/ui/spinner";
import { RootRoute } from "./routes/root";
import { RouteError } from "./routes/route-error";

/** Loads a route module on first visit; each module exports its page as a named component. */
function page<M>(load: () => Promise<M>, pick: (module: M) => ComponentType) {
  return async () => ({ Component: pick(await load()) });
}

export const routes: RouteObject[] = [
  {
    path: "/",
    Component: RootRoute,
    errorElement: <RouteError />,
    hydrateFallbackElement: <LoadingState label="Loading Ringdown…" className="min-h-dvh" />,
    children: [
      { path: "sign-in", lazy: page(() => import("./routes/auth/sign-in"), (m) => m.SignInRoute) },
      { path: "sign-up", lazy: page(() => import("./routes/auth/sign-up"), (m) => m.SignUpRoute) },
      { path: "forgot-password", lazy: page(() => import("./routes/public/forgot-password"), (m) => m.ForgotPasswordRoute) },
      { path: "reset-password/:token", lazy: page(() => import("./routes/public/reset-password"), (m) => m.ResetPasswordRoute) },
      { path: "invitations/:token", lazy: page(() => import("./routes/public/accept-invitation"), (m) => m.AcceptInvitationRoute) },
      { path: "dev/mail", lazy: page(() => import("./routes/public/dev-mail"), (m) => m.DevMailRoute) },
      {
        // Signed-in pages without the rail: the printable setup card and the phone cut-log form (its QR target).
        lazy: page(() => import("./routes/app/focused-layout"), (m) => m.FocusedLayoutRoute),
        errorElement: <RouteError />,
        children: [
          { path: "recipes/:recipeId/card", lazy: page(() => import("./routes/app/recipe-card"), (m) => m.RecipeCardRoute) },
          { path: "log/:recipeId", lazy: page(() => import("./routes/app/log-cut"), (m) => m.LogCutRoute) },
        ],
      },
      {
        lazy: page(() => import("./routes/app/layout"), (m) => m.AppLayoutRoute),
        errorElement: <RouteError />,
        children: [
          { index: true, element: <Navigate to="/planner" replace /> },
          { path: "planner", lazy: page(() => import("./routes/app/planner"), (m) => m.PlannerRoute) },
          { path: "recipes", lazy: page(() => import("./routes/app/recipes"), (m) => m.RecipesRoute) },
          { path: "recipes/:recipeId", lazy: page(() => import("./routes/app/recipe"), (m) => m.RecipeRoute) },
          { path: "cutters", lazy: page(() => import("./routes/app/cutters"), (m) => m.CuttersRoute) },
          { path: "materials", lazy: page(() => import("./routes/app/materials"), (m) => m.MaterialsRoute) },
          { path: "machines", lazy: page(() => import("./routes/app/machines"), (m) => m.MachinesRoute) },
          { path: "machines/new", lazy: page(() => import("./routes/app/machine-new"), (m) => m.MachineNewRoute) },
          { path: "machines/:machineId", lazy: page(() => import("./routes/app/machine-detail"), (m) => m.MachineDetailRoute) },
          { path: "machines/:machineId/vibration", lazy: page(() => import("./routes/app/machine-vibration"), (m) => m.MachineVibrationRoute) },
          {
            path: "machines/:machineId/recordings/:recordingId",
            lazy: page(() => import("./routes/app/machine-recording"), (m) => m.MachineRecordingRoute),
          },
          { path: "team", lazy: page(() => import("./routes/app/team"), (m) => m.TeamRoute) },
          { path: "team/history", lazy: page(() => import("./routes/app/team-history"), (m) => m.TeamHistoryRoute) },
          { path: "billing", lazy: page(() => import("./routes/app/billing"), (m) => m.BillingRoute) },
          { path: "shop-data", lazy: page(() => import("./routes/app/shop-data"), (m) => m.ShopDataRoute) },
          { path: "*", lazy: page(() => import("./routes/not-found"), (m) => m.NotFoundRoute) },
        ],
      },
    ],
  },
];

export function AppRouter() {
  const router = useMemo(() => createBrowserRouter(routes), []);
  return <RouterProvider router={router} />;
}
