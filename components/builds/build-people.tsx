import { zodResolver } from '@hookform/resolvers/zod';
import { useCallback, useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import {
  addMemberInput,
  memberPlaceLabels,
  memberPlaces,
  memberRoleOfPlace,
  removalRefusal,
  singlePlaces,
  type BuildMember,
  type BuildPeople,
} from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { shortDate } from '@/components/findings/finding-row';
import { addressInputProps, FormChoiceField, FormTextField } from '@/components/forms/form-fields';
import { plainParse } from '@/components/forms/plain-errors';
import { applyServerErrors } from '@/components/forms/server-errors';
import { wrapAnywhere } from '@/components/people/long-words';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Label, Mono, Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import {
  useBuildHandOverMutation,
  useBuildMemberAddMutation,
  useBuildMemberRemoveMutation,
} from '@/hooks/queries/builds';

/** Builders first (the owner at the head), then inspectors: the order people think of a build's crew. */
const placeOrder = Object.fromEntries(memberPlaces.map((p, i) => [p, i])) as Record<BuildMember['place'], number>;

/**
 * Who works on the build, in which place, and who was invited but has not joined yet. Adding, removing
 * and handing over appear only when `people.allowed` has them; the owner is never offered for removal
 * (the contract's `removalRefusal`), and the build goes only to a builder already on it.
 */
export function BuildPeopleSection({
  buildId,
  kitSerial,
  people,
  meId,
}: {
  buildId: string;
  kitSerial: string;
  people: BuildPeople;
  meId: string | undefined;
}) {
  const remove = useBuildMemberRemoveMutation(buildId);
  const handOver = useBuildHandOverMutation(buildId);
  const [asking, setAsking] = useState<{ kind: 'remove' | 'hand-over'; m: BuildMember } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [said, setSaid] = useState<string | null>(null);
  const may = (a: BuildPeople['allowed'][number]) => people.allowed.includes(a);
  const members = [...people.members].sort(
    (a, b) => placeOrder[a.place] - placeOrder[b.place] || a.name.localeCompare(b.name),
  );
  const busy = remove.isPending || handOver.isPending;

  const confirm = async () => {
    if (!asking) return;
    setError(null);
    try {
      if (asking.kind === 'remove') {
        await remove.mutateAsync(asking.m.userId);
        setSaid(`${asking.m.name} is off build ${kitSerial}: their access to it has ended.`);
      } else {
        await handOver.mutateAsync(asking.m.userId);
        setSaid(`${asking.m.name} now owns build ${kitSerial}, with its whole log.`);
      }
      setAsking(null);
    } catch (e) {
      setError(errorMessage(e));
    }
  };

  return (
    <Section title="People on this build" testID="build-people">
      {said ? (
        <Notice tone="ok" testID="member-done">
          {said}
        </Notice>
      ) : null}
      <View>
        {members.map((m) => {
          const removable = may('remove') && removalRefusal(m) === null;
          const heir = may('hand-over') && memberRoleOfPlace[m.place] === 'builder' && m.place !== 'owner';
          return (
            <View key={m.userId} style={styles.row} testID={`member-${m.email}`}>
              <View style={styles.line}>
                <Txt bold>{m.name}</Txt>
                {m.userId === meId ? (
                  <Txt variant="small" tone="accent" bold>
                    you
                  </Txt>
                ) : null}
              </View>
              <Txt variant="small" testID={`member-placed-${m.email}`}>
                {memberPlaceLabels[m.place]}
              </Txt>
              <Mono variant="small" tone="soft" style={wrapAnywhere}>
                {m.email}
              </Mono>
              {removable || heir ? (
                <View style={styles.buttons}>
                  {heir ? (
                    <Button
                      label="Hand the build over…"
                      variant="secondary"
                      compact
                      disabled={busy}
                      onPress={() => {
                        setAsking({ kind: 'hand-over', m });
                        setSaid(null);
                        setError(null);
                      }}
                      testID={`member-hand-over-${m.email}`}
                    />
                  ) : null}
                  {removable ? (
                    <Button
                      label="Take off the build…"
                      variant="secondary"
                      compact
                      disabled={busy}
                      onPress={() => {
                        setAsking({ kind: 'remove', m });
                        setSaid(null);
                        setError(null);
                      }}
                      testID={`member-remove-${m.email}`}
                    />
                  ) : null}
                </View>
              ) : null}
              {asking?.m.userId === m.userId ? (
                <View style={{ gap: space.sm }} testID="member-ask">
                  <Notice tone="caution">
                    {asking.kind === 'remove'
                      ? `Take ${m.name} off build ${kitSerial}? They lose access to its parts, findings, photos and log at once. What they did stays in the log.`
                      : `Hand build ${kitSerial} to ${m.name}? They become its owner with the whole build log; the present owner stays on as a helper.`}
                  </Notice>
                  {error ? (
                    <Notice tone="error" testID="member-change-error">
                      {error}
                    </Notice>
                  ) : null}
                  <Button
                    label={asking.kind === 'remove' ? `Take ${m.name} off` : `Hand over to ${m.name}`}
                    variant={asking.kind === 'remove' ? 'danger' : 'primary'}
                    busy={busy}
                    busyLabel="Saving"
                    onPress={() => void confirm()}
                    testID="member-confirm"
                  />
                  <Button
                    label="Leave it as it is"
                    variant="quiet"
                    disabled={busy}
                    onPress={() => {
                      setAsking(null);
                      setError(null);
                    }}
                    testID="member-confirm-cancel"
                  />
                </View>
              ) : null}
            </View>
          );
        })}
        {people.pending.map((p) => (
          <View key={`${p.email}-${p.place}`} style={styles.row} testID={`pending-${p.email}`}>
            <View style={styles.line}>
              <Txt bold tone="soft">
                {p.name}
              </Txt>
              <Txt variant="small" bold tone="caution" testID={`pending-state-${p.email}`}>
                ○ not joined yet
              </Txt>
            </View>
            <Txt variant="small">{memberPlaceLabels[p.place]}</Txt>
            <Mono variant="small" tone="soft" style={wrapAnywhere}>
              {p.email}
            </Mono>
            <Txt variant="small" tone="faint">
              Invited by mail; the link works until {shortDate(p.expiresAt)}.
            </Txt>
          </View>
        ))}
        {!members.length && !people.pending.length ? <Txt tone="soft">Nobody is on this build.</Txt> : null}
      </View>
      {may('add') ? <AddMember buildId={buildId} /> : null}
    </Section>
  );
}

type Values = z.input<typeof addMemberInput>;
type Parsed = z.output<typeof addMemberInput>;

/** The places one can be added to: a build has one owner, who changes by handing over, not by adding. */
const addablePlaces = memberPlaces.filter((p) => !singlePlaces.includes(p));

const placeHints: Record<(typeof memberPlaces)[number], string> = {
  owner: 'Builds and owns the build and its log',
  helper: 'Builds alongside the owner',
  adviser: 'Inspects along the way',
  final_inspector: 'Signs parts off',
};

function AddMember({ buildId }: { buildId: string }) {
  const add = useBuildMemberAddMutation(buildId);
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  // The name is optional: an empty box means "none given", not a name too short.
  const resolver = useCallback<Resolver<Values, unknown, Parsed>>(
    (values, context, options) =>
      zodResolver(addMemberInput, plainParse)(
        { ...values, name: values.name?.trim() ? values.name : undefined },
        context,
        options,
      ),
    [],
  );
  const { control, handleSubmit, setError, reset, formState } = useForm<Values, unknown, Parsed>({
    resolver,
    mode: 'onChange',
    defaultValues: { email: '', place: undefined, name: '' },
  });
  const submit = handleSubmit(async (v) => {
    setFormError(null);
    setAdded(null);
    try {
      const page = await add.mutateAsync(v);
      const joined = page.people.members.some((m) => m.email === v.email);
      setAdded(
        joined
          ? `${v.email} is on the build as ${memberPlaceLabels[v.place].toLowerCase()}.`
          : `${v.email} has no account yet: an invitation is on its way, and they show as not joined until they set a password.`,
      );
      reset({ email: '', place: v.place, name: '' });
    } catch (e) {
      setFormError(applyServerErrors(setError, e, (path) => (['email', 'place', 'name'].includes(path) ? path : null)));
    }
  });
  return (
    <View style={styles.add} testID="member-add-form">
      <Label>Add someone</Label>
      <FormTextField control={control} name="email" label="E-mail" testID="member-email" {...addressInputProps} />
      <FormChoiceField
        control={control}
        name="place"
        label="Place on the build"
        testID="member-place"
        options={addablePlaces.map((p) => ({ value: p, label: memberPlaceLabels[p], hint: placeHints[p] }))}
      />
      <FormTextField
        control={control}
        name="name"
        label="Name (if they have no account yet)"
        hint="An address without a Pitchcard account gets an invitation by mail, addressed by this name."
        testID="member-name"
        maxLength={120}
      />
      {formError ? (
        <Notice tone="error" testID="member-add-error">
          {formError}
        </Notice>
      ) : null}
      {added ? (
        <Notice tone="ok" testID="member-added">
          {added}
        </Notice>
      ) : null}
      <Button
        label="Add to the build"
        busyLabel="Adding"
        busy={formState.isSubmitting}
        onPress={() => void submit()}
        testID="member-add"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: 2, paddingVertical: space.md, borderBottomWidth: hairline, borderColor: colors.rule },
  line: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, paddingTop: space.sm },
  add: { gap: space.md, paddingTop: space.lg },
});
