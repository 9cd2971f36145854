import { Notice } from '@/components/ui/states';

/** The one message at the top or foot of a form, in red; nothing while there is none. */
export function FormError({ message, testID }: { message: string | null | undefined; testID?: string }) {
  return message ? (
    <Notice tone="error" testID={testID}>
      {message}
    </Notice>
  ) : null;
}
