import { ShopDataPage, SHOP_DATA_TITLE } from "@/features/shop-export/components/shop-data-page";
import { useActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

export function ShopDataRoute() {
  useDocumentTitle(SHOP_DATA_TITLE);
  const shop = useActiveShop();
  const units = useUnitSystem();
  return <ShopDataPage shop={shop} preferredUnits={units} />;
}
