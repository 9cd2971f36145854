import { CatalogueScreen } from '@/components/catalogue/catalogue-screen';

export default function Catalogue() {
  return <CatalogueScreen />;
}
