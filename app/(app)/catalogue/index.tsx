import { WhenShown } from '@/components/navigation/when-shown';
import { CatalogueScreen } from '@/components/catalogue/catalogue-screen';

export default function Catalogue() {
  // Beneath a page opened from its link it waits until it is shown (components/navigation/when-shown.tsx).
  return (
    <WhenShown>
      <CatalogueScreen />
    </WhenShown>
  );
}
