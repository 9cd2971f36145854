import { StudyForm, type StudyOutput } from '@/components/studies/study-form';
import {
  gaugeLabel,
  kitIntoStudy,
  nacaDigits,
  newStudyValues,
  studyValues,
  toggleGauge,
  toggleRivet,
} from '@/components/studies/study-form-values';
import { ApiError } from '@/lib/api-client';
import { demoKit, renderInUnits } from './studies-render';

// Whole screens render in jsdom: slower than a unit test, more so when the machine is busy.
jest.setTimeout(30_000);

const kit = demoKit;

function renderForm(system: 'imperial' | 'metric', onSubmit: (v: StudyOutput) => Promise<void>) {
  return renderInUnits(
    system,
    <StudyForm kits={[kit]} defaultValues={newStudyValues(kit)} isNew submitLabel="Compute" onSubmit={onSubmit} />,
  );
}

describe('the study form’s values', () => {
  it('starts a new study from the kit model’s design data', () => {
    const v = newStudyValues(kit);
    expect(v.kitModelId).toBe(kit.id);
    expect(v.inputs.kit).toMatchObject({
      weightLb: 1320,
      wingAreaSqFt: 120,
      meanChordIn: 54,
      stallSpeedKeas: 47,
      cruiseSpeedKeas: 118,
      category: 'utility',
    });
    expect(v.inputs.airfoil).toEqual({ kind: 'naca', designation: '2412' });
    expect(v.inputs.rib.chordIn).toBe(54);
    expect(v.inputs.rib.spacingIn).toBeUndefined();
  });

  it('keeps a rib chord already set when the kit data are taken again', () => {
    const v = kitIntoStudy(
      { ...newStudyValues(), inputs: { ...newStudyValues().inputs, rib: { chordIn: 40, spacingIn: 14 } } },
      kit,
    );
    expect(v.inputs.rib).toEqual({ chordIn: 40, spacingIn: 14 });
  });

  it('reads the digits out of the kit model’s airfoil name', () => {
    expect(nacaDigits('NACA 23012')).toBe('23012');
    expect(nacaDigits('Clark Y')).toBe('');
  });

  it('labels the gauge chips in the chosen units and keeps the gauges in inches, ascending', () => {
    expect(gaugeLabel(0.02, 'imperial')).toBe('0.020 in');
    expect(gaugeLabel(0.02, 'metric')).toBe('0.51 mm');
    expect(toggleGauge([0.04, 0.016], '0.025')).toEqual([0.016, 0.025, 0.04]);
    expect(toggleGauge([0.016, 0.025], '0.025')).toEqual([0.016]);
  });

  it('keeps the chosen rivets in family and size order', () => {
    expect(toggleRivet(['PULLED-4', 'MS20470AD4'], 'MS20470AD3')).toEqual(['MS20470AD3', 'MS20470AD4', 'PULLED-4']);
    expect(toggleRivet(['PULLED-4'], 'PULLED-4')).toEqual([]);
  });

  it('copies a stored revision so editing the form cannot change the cached one', () => {
    const stored = { kitModelId: kit.id, name: 'S', inputs: newStudyValues(kit).inputs as never };
    const v = studyValues(stored);
    v.inputs.lines[0].name = 'changed';
    expect((stored.inputs as { lines: { name: string }[] }).lines[0].name).toBe('Upper flange');
  });
});

describe('the study form', () => {
  it('takes millimetres, kilograms and square metres on the metric switch and sends inches, pounds and square feet', async () => {
    const sent: StudyOutput[] = [];
    const r = renderForm('metric', async (v) => {
      sent.push(v);
    });
    expect(r.byTestId('study-rib-chord-field').textContent).toContain('mm');
    await r.type('study-name', 'Metric rib');
    await r.type('study-weight', '600');
    await r.type('study-wing-area', '11.148');
    await r.type('study-rib-chord', '1371.6');
    await r.type('study-rib-spacing', '368.3');
    await r.type('study-pitch-increment', '3.175');
    await r.press('study-compute');
    expect(sent).toHaveLength(1);
    const i = sent[0].inputs;
    expect(i.kit.weightLb).toBeCloseTo(600 / 0.45359237, 6);
    expect(i.kit.wingAreaSqFt).toBeCloseTo(11.148 / 0.09290304, 6);
    expect(i.rib.chordIn).toBeCloseTo(54, 9);
    expect(i.rib.spacingIn).toBeCloseTo(14.5, 9);
    expect(i.pitchIncrementIn).toBeCloseTo(0.125, 9);
    // Speeds stay in knots, whatever the switch says.
    expect(i.kit.stallSpeedKeas).toBe(47);
  });

  it('shows the stored inches in millimetres when the form opens on the metric switch', () => {
    const r = renderForm('metric', async () => {});
    expect((r.byTestId('study-mean-chord') as HTMLInputElement).value).toBe('1371.6');
    expect(r.byTestId('study-gauge-0.02').textContent).toBe('0.51 mm');
  });

  it('says in plain words what is wrong as it is typed', async () => {
    const r = renderForm('imperial', async () => {});
    await r.type('study-weight', '-5');
    expect(r.byTestId('study-weight-field-error').textContent).toBe('weight must be greater than zero');
    await r.type('study-cruise', '40');
    expect(r.byTestId('study-cruise-field-error').textContent).toBe('cruise speed must be above the stall speed');
    await r.type('study-line-0-end', '0.01');
    expect(r.byTestId('study-line-0-end-field-error').textContent).toBe('the line must end aft of its start');
  });

  it('does not send a study without a single gauge to try', async () => {
    const sent: StudyOutput[] = [];
    const r = renderForm('imperial', async (v) => {
      sent.push(v);
    });
    await r.type('study-name', 'No gauges');
    await r.type('study-rib-spacing', '14.5');
    for (const g of ['0.016', '0.02', '0.025', '0.032', '0.04']) await r.press(`study-gauge-${g}`);
    await r.press('study-compute');
    expect(sent).toHaveLength(0);
    expect(r.byTestId('study-gauges-field').textContent).toContain('choose at least one gauge');
  });

  it('puts the engine’s complaint about a line on that line’s field', async () => {
    const r = renderForm('imperial', async () => {
      throw new ApiError(
        400,
        'invalid_input',
        'lines[1].endXc: the end must be a fraction of the chord after the start and at most 1',
        {
          'lines[1].endXc': 'the end must be a fraction of the chord after the start and at most 1',
        },
      );
    });
    await r.type('study-name', 'Engine says no');
    await r.type('study-rib-spacing', '14.5');
    await r.press('study-compute');
    expect(r.byTestId('study-line-1-end-field-error').textContent).toContain('after the start');
    expect(r.byTestId('study-form-error').textContent).toContain('See the marked fields');
  });

  it('says a complaint it has no field for at the top of the form', async () => {
    const r = renderForm('imperial', async () => {
      throw new ApiError(400, 'invalid_input', 'cellAreaSqIn: the wing torque and the cell area go together', {
        cellAreaSqIn: 'the wing torque and the cell area go together',
      });
    });
    await r.type('study-name', 'Top');
    await r.type('study-rib-spacing', '14.5');
    await r.press('study-compute');
    expect(r.byTestId('study-form-error').textContent).toContain('the wing torque and the cell area go together');
  });

  it('words a refusal as not computed, without the server’s field paths, and a stop by its own checks as a look', async () => {
    let refusal = new ApiError(400, 'invalid_input', 'cellAreaSqIn: the wing torque and the cell area go together', {
      cellAreaSqIn: 'the wing torque and the cell area go together.',
    });
    const r = renderForm('imperial', async () => {
      throw refusal;
    });
    await r.type('study-name', 'Words');
    await r.type('study-rib-spacing', '14.5');
    await r.press('study-compute');
    expect(r.byTestId('study-form-error').textContent).toBe(
      'Not computed: the wing torque and the cell area go together.',
    );
    refusal = new ApiError(400, 'invalid_input', 'lines[1].endXc: after the start', {
      'lines[1].endXc': 'after the start',
    });
    await r.press('study-compute');
    expect(r.byTestId('study-form-error').textContent).toBe(
      'Not computed: some inputs were refused. See the marked fields.',
    );
    await r.type('study-weight', '-5');
    await r.press('study-compute');
    expect(r.byTestId('study-form-error').textContent).toBe('Some inputs need a look: see the messages in red.');
  });

  it('adds and removes fastener lines', async () => {
    const r = renderForm('imperial', async () => {});
    await r.press('study-line-add');
    expect(r.queryByTestId('study-line-2')).not.toBeNull();
    await r.press('study-line-2-remove');
    expect(r.queryByTestId('study-line-2')).toBeNull();
  });

  it('reads pasted coordinates into points and counts them', async () => {
    const r = renderForm('imperial', async () => {});
    await r.press('study-airfoil-kind-coordinates');
    await r.type('study-coordinates', 'My section\n1.0 0.0\n0.5 0.06\n0.0 0.0\n0.5 -0.04\n1.0 0.0');
    expect(r.byTestId('study-coordinates-count').textContent).toBe('5 points read');
    expect(r.byTestId('study-coordinates-field-error').textContent).toBe('an airfoil needs at least ten points');
  });
});
