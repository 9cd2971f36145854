import { Txt } from '@/components/ui/text';

/** Native builds have no web frame to draw a mail's HTML in; the text part shows beside this. */
export function MailHtml(_: { html: string; title: string }) {
  return (
    <Txt variant="small" tone="faint" testID="mail-html-native">
      The HTML of this mail shows on the web page.
    </Txt>
  );
}
