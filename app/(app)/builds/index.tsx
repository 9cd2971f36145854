import { WhenShown } from '@/components/navigation/when-shown';
import { BuildsScreen } from '@/components/builds/builds-screen';

export default function Builds() {
  // Beneath a page opened from its link it waits until it is shown (components/navigation/when-shown.tsx).
  return (
    <WhenShown>
      <BuildsScreen />
    </WhenShown>
  );
}
