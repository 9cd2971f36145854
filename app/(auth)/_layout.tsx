import { Stack } from 'expo-router';

// The group's first page when the guard sends a signed-out person here: sign in, not the forgotten-password page.
export const unstable_settings = { initialRouteName: 'sign-in' };

export default function AuthLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
