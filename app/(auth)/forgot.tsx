import { ForgotScreen } from '@/components/auth/forgot-screen';

export default function Forgot() {
  return <ForgotScreen />;
}
