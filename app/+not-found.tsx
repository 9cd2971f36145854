import { NotFoundScreen } from '@/components/not-found/not-found-screen';

export default function NotFound() {
  return <NotFoundScreen />;
}
