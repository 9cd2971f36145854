import { Platform, type TextStyle } from 'react-native';

/**
 * An e-mail address has no space to break at: on a phone a long one would run off the sheet. The web
 * breaks it anywhere instead; native text wraps long words on its own.
 */
export const wrapAnywhere: TextStyle | undefined =
  Platform.OS === 'web' ? ({ overflowWrap: 'anywhere', wordBreak: 'break-word' } as unknown as TextStyle) : undefined;
