import { useIsFocused } from 'expo-router';
import { useState, type ReactNode } from 'react';

/**
 * Draws a list page only once it has been on screen. A page opened straight from its link (a
 * traveler, a finding) has its stack's first page (initialRouteName: the list) mounted beneath it, so
 * that going back lands on the list; drawn at once, that hidden list would fetch and lay out its rows
 * while the page asked for is still loading. It is drawn, and fetches, when it is first shown.
 */
export function WhenShown({ children }: { children: ReactNode }) {
  const focused = useIsFocused();
  const [shown, setShown] = useState(focused);
  // Remembered while rendering (React's "adjusting state when a prop changes"), not in an effect after it.
  if (focused && !shown) setShown(true);
  return shown || focused ? children : null;
}
