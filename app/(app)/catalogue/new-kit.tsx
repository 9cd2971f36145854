import { KitFormScreen } from '@/components/kits/kit-form-screen';

export default function NewKit() {
  return <KitFormScreen />;
}
