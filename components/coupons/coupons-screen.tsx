import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { couponOutcomeLabels, type CouponAllowance, type CouponOutcome, type CouponTest } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { Choice } from '@/components/ui/choice';
import { Field } from '@/components/ui/field';
import { LoadMore, nextPage } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { Table, type Column, type SortState } from '@/components/ui/table';
import { Mono, Txt } from '@/components/ui/text';
import { TwoPane } from '@/components/ui/two-pane';
import { errorMessage } from '@/lib/api-client';
import { useCouponAllowablesQuery, useCouponDeleteMutation, useCouponsQuery } from '@/hooks/queries/coupons';
import { pagedItems } from '@/hooks/queries/paged';
import { useUnits } from '@/hooks/use-units';
import { forceNumber } from '@/components/studies/study-numbers';
import { ConfirmStep } from '@/components/designs/confirm-step';
import { Button } from '@/components/ui/button';
import { CouponCorrectionForm } from './coupon-correction';
import { CouponForm } from './coupon-form';
import {
  ALL,
  filterAllowances,
  filterCoupons,
  filterValues,
  sortCoupons,
  type CouponFilters,
  type CouponSortKey,
} from './coupon-groups';

/** Worse outcomes read darker; the words always say which it is. */
const outcomeTone: Record<CouponOutcome, 'ink' | 'soft' | 'error'> = {
  no_deformation: 'ink',
  slight_deformation: 'ink',
  excessive_deformation: 'error',
  failure: 'error',
};
/** A corrected entry's numbers are struck through: still readable, plainly no longer in use. */
const struck = (t: CouponTest) =>
  t.correctedBy ? { textDecorationLine: 'line-through' as const, opacity: 0.7 } : undefined;
const outcomeMark: Record<CouponOutcome, string> = {
  no_deformation: '○',
  slight_deformation: '◐',
  excessive_deformation: '◉',
  failure: '✕',
};

export const groupTestId = (g: Pick<CouponAllowance, 'material' | 'gaugeIn' | 'rivetSpec'>) =>
  `coupon-group-${g.material}-${g.gaugeIn}-${g.rivetSpec}`;

function Allowables({ groups }: { groups: CouponAllowance[] }) {
  const u = useUnits();
  return (
    <View style={{ gap: space.md }} testID="coupon-allowables">
      <Txt variant="small" testID="coupon-rule">
        <Txt variant="small" bold>
          Limit:{' '}
        </Txt>
        the highest load that left no permanent deformation.{' '}
        <Txt variant="small" bold>
          Ultimate:{' '}
        </Txt>
        the highest load carried without failure, slight deformation allowed; excessive deformation counts as failure. A
        good result at or above a load where another coupon of the same set did worse is not counted. Studies computed
        from now on use these as the pull-through allowables; a pair with no tests gets a conservative fallback.
      </Txt>
      {groups.length ? (
        groups.map((g) => (
          <View key={groupTestId(g)} style={styles.group} testID={groupTestId(g)}>
            <Txt bold>
              <Mono bold>{g.material}</Mono> · <Mono bold>{u.length(g.gaugeIn)}</Mono> · <Mono bold>{g.rivetSpec}</Mono>
              <Txt variant="small" tone="soft">
                {' '}
                · {g.tests.length} test{g.tests.length === 1 ? '' : 's'}
              </Txt>
            </Txt>
            <View style={{ flexDirection: 'row', gap: space.xl, flexWrap: 'wrap' }}>
              <Txt testID={`${groupTestId(g)}-limit`}>
                limit{' '}
                <Mono bold tone={g.limitLb > 0 ? 'ink' : 'error'}>
                  {u.force(g.limitLb)}
                </Mono>
              </Txt>
              <Txt testID={`${groupTestId(g)}-ultimate`}>
                ultimate{' '}
                <Mono bold tone={g.ultimateLb > 0 ? 'ink' : 'error'}>
                  {u.force(g.ultimateLb)}
                </Mono>
              </Txt>
            </View>
            {g.limitLb === 0 || g.ultimateLb === 0 ? (
              <Txt variant="small" tone="error">
                No coupon qualified
                {g.limitLb === 0 && g.ultimateLb === 0 ? '' : g.limitLb === 0 ? ' at limit' : ' at ultimate'}: a study
                finds this pair cannot carry the pull.
              </Txt>
            ) : null}
          </View>
        ))
      ) : (
        <Txt tone="soft">No tests yet.</Txt>
      )}
    </View>
  );
}

/** The supplier's coupon tests: the record, the allowables derived from it, and a form for the next. */
export function CouponsScreen() {
  const u = useUnits();
  const q = useCouponsQuery();
  // The pages of the record loaded so far; the filters and the sort work on these (the allowables cover every test).
  const all = useMemo(() => pagedItems(q.data), [q.data]);
  const [filters, setFilters] = useState<CouponFilters>({ material: ALL, gauge: ALL, rivet: ALL });
  const [sort, setSort] = useState<SortState<CouponSortKey>>({ key: 'tested', dir: 'desc' });
  const values = useMemo(() => filterValues(all), [all]);
  const shown = useMemo(() => sortCoupons(filterCoupons(all, filters), sort), [all, filters, sort]);
  const allowances = useCouponAllowablesQuery();
  const groups = useMemo(() => filterAllowances(allowances.data ?? [], filters), [allowances.data, filters]);

  const [correcting, setCorrecting] = useState<CouponTest | null>(null);
  const [deleting, setDeleting] = useState<CouponTest | null>(null);
  const [said, setSaid] = useState<string | null>(null);
  const remove = useCouponDeleteMutation();
  const confirmDelete = async () => {
    if (!deleting) return;
    try {
      await remove.mutateAsync(deleting.id);
      setSaid(`Deleted the test of ${u.force(deleting.loadLb)} on ${u.length(deleting.gaugeIn)} ${deleting.material}.`);
      setDeleting(null);
    } catch {
      // The error shows in the confirmation, from the mutation's own state.
    }
  };

  /** Where the test stands in the record, and what may be done with it (from the answer's list only). */
  const record = (t: CouponTest) => (
    <View style={{ gap: space.xs }}>
      {t.correctedBy ? (
        <Txt variant="small" tone="caution" testID={`coupon-corrected-${t.id}`}>
          ✎ Corrected {t.correctedBy.at.slice(0, 10)} by {t.correctedBy.byName}: {t.correctedBy.reason}. Kept as
          recorded; not used.
        </Txt>
      ) : t.correctionReason ? (
        <Txt variant="small" testID={`coupon-correction-of-${t.id}`}>
          Correction: {t.correctionReason}
        </Txt>
      ) : null}
      {t.backs.length ? (
        <Txt variant="small" tone="soft">
          May back {t.backs.join(', ')}
        </Txt>
      ) : null}
      {t.allowedActions.length ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          {t.allowedActions.includes('correct') ? (
            <Button
              label="Correct…"
              variant="secondary"
              compact
              onPress={() => {
                setCorrecting(t);
                setDeleting(null);
                setSaid(null);
              }}
              testID={`coupon-correct-${t.id}`}
            />
          ) : null}
          {t.allowedActions.includes('delete') ? (
            <Button
              label="Delete…"
              variant="quiet"
              compact
              onPress={() => {
                setDeleting(t);
                setCorrecting(null);
                setSaid(null);
                remove.reset();
              }}
              testID={`coupon-delete-${t.id}`}
            />
          ) : null}
        </View>
      ) : null}
      {deleting?.id === t.id ? (
        <ConfirmStep
          testID="coupon-delete-ask"
          message={`Delete this test (${u.force(t.loadLb)}, ${couponOutcomeLabels[t.outcome].toLowerCase()})${t.correctionReason ? ' and the entries it corrected' : ''}? It leaves the record and the allowables; no published revision rests on it.`}
          confirmLabel="Delete the test"
          danger
          busy={remove.isPending}
          error={remove.error ? errorMessage(remove.error) : null}
          onConfirm={() => void confirmDelete()}
          onCancel={() => setDeleting(null)}
        />
      ) : null}
    </View>
  );

  const lu = u.label('length');
  const fu = u.label('force');
  const columns: Column<CouponTest, CouponSortKey>[] = [
    {
      key: 'tested',
      title: 'Tested',
      sortKey: 'tested',
      flex: 1.35,
      render: (t) => <Mono variant="small">{t.testedOn}</Mono>,
    },
    {
      key: 'material',
      title: 'Material',
      sortKey: 'material',
      flex: 1.1,
      render: (t) => <Mono variant="small">{t.material}</Mono>,
    },
    {
      key: 'gauge',
      title: `Gauge, ${lu}`,
      sortKey: 'gauge',
      flex: 0.9,
      render: (t) => (
        <Mono bold style={struck(t)}>
          {u.lengthNumber(t.gaugeIn)}
        </Mono>
      ),
    },
    {
      key: 'width',
      title: `Width, ${lu}`,
      flex: 0.8,
      render: (t) => <Mono variant="small">{u.lengthNumber(t.couponWidthIn)}</Mono>,
    },
    {
      key: 'rivet',
      title: 'Rivet',
      sortKey: 'rivet',
      flex: 1.25,
      render: (t) => <Mono variant="small">{t.rivetSpec}</Mono>,
    },
    {
      key: 'load',
      title: `Load, ${fu}`,
      sortKey: 'load',
      flex: 0.85,
      render: (t) => (
        <Mono bold style={struck(t)} testID={`coupon-load-${t.id}`}>
          {forceNumber(t.loadLb, u.system)}
        </Mono>
      ),
    },
    {
      key: 'outcome',
      title: 'Outcome',
      sortKey: 'outcome',
      flex: 1.5,
      render: (t) => (
        <Txt variant="small" bold={outcomeTone[t.outcome] === 'error'} tone={outcomeTone[t.outcome]}>
          {outcomeMark[t.outcome]} {couponOutcomeLabels[t.outcome]}
        </Txt>
      ),
    },
    {
      key: 'note',
      title: 'Note',
      flex: 1.8,
      render: (t) => (
        <Txt variant="small" tone="soft">
          {t.note || '–'}
          {t.createdByName ? ` · ${t.createdByName}` : ''}
        </Txt>
      ),
    },
    { key: 'record', title: 'Record', flex: 1.8, render: record },
  ];

  const chip = (v: string, label: string) => ({ value: v, label });
  const header = (
    <View style={{ gap: space.md, paddingBottom: space.md }}>
      {values.materials.length > 1 ? (
        <Field label="Material">
          <Choice
            testIDPrefix="coupon-filter-material"
            value={filters.material}
            onChange={(material) => setFilters((f) => ({ ...f, material }))}
            options={[chip(ALL, 'All'), ...values.materials.map((m) => chip(m, m))]}
          />
        </Field>
      ) : null}
      <Field label="Gauge">
        <Choice
          testIDPrefix="coupon-filter-gauge"
          value={filters.gauge}
          onChange={(gauge) => setFilters((f) => ({ ...f, gauge }))}
          options={[chip(ALL, 'All'), ...values.gauges.map((g) => chip(String(g), u.length(g)))]}
        />
      </Field>
      <Field label="Rivet">
        <Choice
          testIDPrefix="coupon-filter-rivet"
          value={filters.rivet}
          onChange={(rivet) => setFilters((f) => ({ ...f, rivet }))}
          options={[chip(ALL, 'All'), ...values.rivets.map((r) => chip(r, r))]}
        />
      </Field>
      <Txt variant="small" tone="soft" testID="coupon-count">
        {shown.length} of {all.length}
        {q.hasNextPage ? ' loaded' : ''} tests shown
      </Txt>
    </View>
  );

  const left = (
    <Section title="Coupon tests" testID="coupon-tests">
      {q.isPending ? (
        <LoadingState what="Loading the coupon tests" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : !all.length ? (
        <EmptyState
          title="No coupon tests yet."
          body="Record a flange coupon test: gauge, rivet, the load you applied and what the coupon did. Studies take their pull-through allowables from these."
        />
      ) : (
        <Table
          rows={shown}
          columns={columns}
          rowKey={(t) => t.id}
          sort={sort}
          onSort={(key) =>
            setSort((s) => (s.key === key ? { key, dir: s.dir === 'asc' ? 'desc' : 'asc' } : { key, dir: 'asc' }))
          }
          rowTestID={(t) => `coupon-row-${t.id}`}
          header={header}
          empty={<EmptyState title="Nothing matches these filters." body="Choose All to see every test." />}
        />
      )}
      {q.isSuccess && all.length ? (
        <LoadMore {...nextPage(q)} shown={all.length} what="tests" testID="coupons-more" />
      ) : null}
    </Section>
  );

  const right = (
    <>
      <Section
        title={
          filters.material === ALL && filters.gauge === ALL && filters.rivet === ALL
            ? 'Allowables from the tests'
            : 'Allowables of the tests shown'
        }
      >
        {allowances.isPending ? (
          <LoadingState what="Working out the allowables" />
        ) : allowances.isError ? (
          <ErrorState error={allowances.error} onRetry={() => void allowances.refetch()} />
        ) : (
          <Allowables groups={groups} />
        )}
        <Caution testID="coupon-caution" />
      </Section>
      {said ? (
        <Notice tone="ok" testID="coupon-change-done">
          {said}
        </Notice>
      ) : null}
      {correcting ? (
        <Section title={`Correct the test of ${u.force(correcting.loadLb)} on ${u.length(correcting.gaugeIn)}`}>
          <CouponCorrectionForm
            key={correcting.id}
            test={correcting}
            onDone={(m) => {
              setCorrecting(null);
              setSaid(m || null);
            }}
          />
        </Section>
      ) : (
        <Section title="Record a test">
          <CouponForm />
        </Section>
      )}
    </>
  );

  return (
    <Screen
      title="Coupon tests"
      subtitle="Flange pull-through tests and the allowables they back"
      account
      full
      testID="coupons-screen"
    >
      <TwoPane left={left} right={right} leftWidth={0.62} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs, paddingVertical: space.sm, borderBottomWidth: hairline, borderColor: colors.rule },
});
