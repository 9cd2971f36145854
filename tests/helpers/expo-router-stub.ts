/**
 * expo-router for the screen tests that need a router to exist and look at none of its moves: each
 * move a fresh jest.fn, no page to go back to. In a test file:
 * `jest.mock('expo-router', () => jest.requireActual('../helpers/expo-router-stub'));`
 */
export const useRouter = () => ({
  push: jest.fn(),
  replace: jest.fn(),
  back: jest.fn(),
  dismissTo: jest.fn(),
  canGoBack: () => false,
});
