import { SignInScreen } from '@/components/auth/sign-in-screen';

export default function SignIn() {
  return <SignInScreen />;
}
