import { CuttersPage } from "@/features/cutters/components/cutters-page";

export function CuttersRoute() {
  return <CuttersPage />;
}
