import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { lookupInput } from '@/db/contracts';
import { space } from '@/constants/theme';
import { FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { ApiError, errorMessage } from '@/lib/api-client';

/** Typing the short code from the label, for when the camera cannot read it. */
export function ShortCodeEntry({ onOpen }: { onOpen: (code: string) => Promise<void> }) {
  const [problem, setProblem] = useState<string | null>(null);
  const { control, handleSubmit, formState } = useForm<
    z.input<typeof lookupInput>,
    unknown,
    z.output<typeof lookupInput>
  >({
    resolver: zodResolver(lookupInput, plainParse),
    mode: 'onChange',
    defaultValues: { code: '' },
  });
  const submit = handleSubmit(async ({ code }) => {
    setProblem(null);
    try {
      await onOpen(code);
    } catch (e) {
      setProblem(
        e instanceof ApiError && e.status === 404
          ? `No part with the code “${code.toUpperCase()}” in your builds. Check the label and try again.`
          : errorMessage(e),
      );
    }
  });
  return (
    <View style={{ gap: space.sm }}>
      <FormTextField
        control={control}
        name="code"
        label="Short code"
        hint="The code printed under the QR, e.g. K7P-4QX"
        testID="short-code"
        autoCapitalize="characters"
        autoCorrect={false}
        mono
        onSubmitEditing={() => void submit()}
        returnKeyType="go"
      />
      {problem ? (
        <Notice tone="error" testID="short-code-problem">
          {problem}
        </Notice>
      ) : null}
      <Button
        label="Open part"
        busyLabel="Looking it up"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="open-code"
      />
    </View>
  );
}
