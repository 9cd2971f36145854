import { colors, hairline } from '@/constants/theme';

/**
 * A mail's HTML as a mail client would show it, in a frame with every sandbox restriction on: no
 * script runs and the frame has no origin, so nothing in a mail can reach the app or its token.
 */
export function MailHtml({ html, title }: { html: string; title: string }) {
  return (
    <iframe
      title={`Mail: ${title}`}
      sandbox=""
      srcDoc={html}
      data-testid="mail-html"
      style={{ width: '100%', minHeight: 360, border: `${hairline}px solid ${colors.rule}`, background: '#fff' }}
    />
  );
}
