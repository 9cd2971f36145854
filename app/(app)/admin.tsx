import { AdminScreen } from '@/components/admin/admin-screen';

export default function Admin() {
  return <AdminScreen />;
}
