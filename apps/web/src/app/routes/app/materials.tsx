import { MaterialsPage } from "@/features/materials/components/materials-page";

export function MaterialsRoute() {
  return <MaterialsPage />;
}
