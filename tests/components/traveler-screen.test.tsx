import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import type { TravelerDetail } from '@/db/contracts';
import { TravelerScreen } from '@/components/travelers/traveler-screen';
import { travelerKeys } from '@/hooks/queries/travelers';
import { SessionProvider } from '@/hooks/use-session';
import { renderWeb } from './render-web';

const zones = [{ fromIn: 0, toIn: 4, pitchIn: 1 }];
const detail: TravelerDetail = {
  id: 'trav-1', serial: 'NK2-0147-W-104', shortCode: 'EDN-CY6', buildId: 'b1', kitSerial: 'NK2-0147',
  partNumber: 'W-104', partName: 'Wing rib, inboard', kind: 'rib', letter: 'A',
  holesTotal: 4, holesDone: 1, openFindings: 0, signedOff: false, newerRevision: 'B',
  material: '6061-T6', gaugeIn: 0.025, rivetSpec: 'MS20470AD4', drillSize: '#30', drillDiameterIn: 0.1285,
  edgeDistanceIn: 0.25, chordIn: 10,
  lines: [{ code: 'U', name: 'Upper flange', surface: 'upper', startIn: 1, lengthIn: 4, zones }],
  outline: [[0, 0], [3, 1.5], [10, 0], [10, -0.5], [0, -0.5]],
  holes: [
    { holeId: 'U-01', line: 'U', seq: 1, stationIn: 0.25, status: 'installed' },
    { holeId: 'U-02', line: 'U', seq: 2, stationIn: 1.25, status: 'pending' },
    { holeId: 'U-03', line: 'U', seq: 3, stationIn: 2.25, status: 'flagged' },
    { holeId: 'U-04', line: 'U', seq: 4, stationIn: 3.75, status: 'pending' },
  ],
  steps: [{ id: 's1', seq: 1, text: 'Deburr all holes', doneAt: null, doneByName: null }],
  findings: [], approvedByName: 'Maren Holt', signedOffAt: null, signedOffByName: null,
};

function renderTraveler() {
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  qc.setQueryData(travelerKeys.detail(detail.id), detail);
  return renderWeb(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={qc}>
        <SessionProvider>
          <TravelerScreen travelerId={detail.id} />
        </SessionProvider>
      </QueryClientProvider>
    </SafeAreaProvider>,
  );
}

describe('the traveler screen', () => {
  it('shows the header numbers in the units chosen, with the caution and the approver', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('gauge').textContent).toContain('0.025 in');
    expect(r.byTestId('drill').textContent).toContain('0.1285 in');
    expect(r.byTestId('edge-distance').textContent).toContain('0.250 in');
    expect(r.byTestId('caution').textContent).toContain('not certification');
    expect(r.byTestId('approved-by').textContent).toContain('Maren Holt');
  });

  it('warns that a newer revision is out', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('newer-revision').textContent).toContain('Revision B');
  });

  it('lists every hole with its own large target and status', async () => {
    const r = renderTraveler();
    await r.settle();
    for (const id of ['U-01', 'U-02', 'U-03', 'U-04']) expect(r.byTestId(`hole-${id}`)).toBeTruthy();
    expect(r.byTestId('hole-U-03').getAttribute('aria-label')).toContain('Flagged');
    expect(r.byTestId('progress-count').textContent).toBe('1 / 4');
  });

  it('shows the pitch schedule zones of each line', async () => {
    const r = renderTraveler();
    await r.settle();
    expect(r.byTestId('zones-U').textContent).toContain('1.00');
  });
});
