import { CouponsScreen } from '@/components/coupons/coupons-screen';

export default function Coupons() {
  return <CouponsScreen />;
}
