import { HomeRedirect } from '@/components/navigation/home-redirect';

export default function Home() {
  return <HomeRedirect />;
}
