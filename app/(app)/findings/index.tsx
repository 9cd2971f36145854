import { WhenShown } from '@/components/navigation/when-shown';
import { FindingsHomeScreen } from '@/components/findings/findings-home-screen';

export default function Findings() {
  // Beneath a page opened from its link it waits until it is shown (components/navigation/when-shown.tsx).
  return (
    <WhenShown>
      <FindingsHomeScreen />
    </WhenShown>
  );
}
