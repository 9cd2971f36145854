import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fabricationTable } from '@/db/contracts';
import { FabricationSection } from '@/components/builds/fabrication-section';
import { buildKeys } from '@/hooks/queries/builds';
import { renderWeb } from './render-web';

describe('the fabrication-and-assembly section', () => {
  it('shows each part, the build’s total share and the caution that it decides nothing', async () => {
    const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
    // Hand-counted: W-104 drill + rivet by the builder, rivet by commercial help → 2 of 3 (67 %);
    // W-201 dimple by the builder, drill by the kit supplier → 1 of 2; the build 3 of 5 → 60 %.
    qc.setQueryData(
      buildKeys.fabrication('b1'),
      fabricationTable([
        {
          travelerId: 'a',
          partNumber: 'W-104',
          partName: 'Rib',
          serial: 'K-W-104',
          steps: [
            { kind: 'drill', done: true, by: 'builder' },
            { kind: 'rivet', done: true, by: 'builder' },
            { kind: 'rivet', done: true, by: 'commercial' },
          ],
        },
        {
          travelerId: 'b',
          partNumber: 'W-201',
          partName: 'Skin',
          serial: 'K-W-201',
          steps: [
            { kind: 'dimple_countersink', done: true, by: 'builder' },
            { kind: 'drill', done: true, by: 'kit_supplier' },
          ],
        },
      ]),
    );
    const r = renderWeb(
      <QueryClientProvider client={qc}>
        <FabricationSection buildId="b1" />
      </QueryClientProvider>,
    );
    await r.settle();
    expect(r.byTestId('fabrication-W-104').textContent).toContain('67 %');
    expect(r.byTestId('fabrication-total').textContent).toContain('60 %');
    expect(r.byTestId('fabrication-caution').textContent).toContain('only the aviation authority decides eligibility');
  });
});
