import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useEffectEvent, useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';

import { BookingPhotoPicker } from '@/components/bookings/booking-photo-picker';
import { applyServerErrors } from '@/components/bookings/server-errors';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { FormNumberField, FormTextField } from '@/components/ui/form-fields';
import { SegmentedControl } from '@/components/ui/segmented-control';
import type { Polarity } from '@/shared/schemas/items';
import { benchRunEditSchema, benchRunInputSchema, type BenchRun, type BenchRunEdit, type BenchRunInput } from '@/shared/schemas/bench-runs';

import { payloadOf, valuesFromRun, type RunFormValues } from './run-values';

const SETUP_FIELDS = [
  'gapMm',
  'stages',
  'massG',
  'outletAreaCm2',
  'temperatureC',
  'pressureKpa',
  'humidityPct',
  'wireRadiusMm',
  'collectorRadiusMm',
  'surfaceFactor',
] as const;

function setupSummary(run: BenchRun | undefined): string {
  if (!run) return '';
  const parts = [
    `Gap ${run.gapMm} mm`,
    run.stages === null ? null : `${run.stages} ${run.stages === 1 ? 'stage' : 'stages'}`,
    run.massG === null ? null : `${run.massG} g`,
    run.outletAreaCm2 === null ? null : `${run.outletAreaCm2} cm² outlet`,
    run.temperatureC === null ? null : `${run.temperatureC} °C, ${run.pressureKpa ?? '—'} kPa, ${run.humidityPct ?? '—'} % RH`,
  ];
  return `Same as run ${run.number}: ${parts.filter(Boolean).join(' · ')}.`;
}

const FIELDS = [
  'appliedKv',
  'polarity',
  'currentMa',
  'currentUa',
  'gapMm',
  'stages',
  'velocityMps',
  'thrustMn',
  'thrustGf',
  'massG',
  'outletAreaCm2',
  'temperatureC',
  'pressureKpa',
  'humidityPct',
  'notes',
  'photoFileId',
  'wireRadiusMm',
  'collectorRadiusMm',
  'surfaceFactor',
  'reason',
] as const;

interface RunFormProps {
  bookingId: number;
  /** The run a new one starts from (the last), or the run being corrected. */
  from: BenchRun | undefined;
  mode: 'new' | 'edit';
  planPolarity: Polarity;
  onSubmit: (values: BenchRunInput | BenchRunEdit) => Promise<unknown>;
  onCancel?: () => void;
  testID: string;
}

/**
 * One bench reading. Phone first: the knobs that change from point to point (voltage, current,
 * thrust, velocity) come first; the setup (gap, stages, device, ambient, geometry) is prefilled
 * from the last run and sits further down.
 */
export function RunForm({ bookingId, from, mode, planPolarity, onSubmit, onCancel, testID }: RunFormProps) {
  const schema = mode === 'edit' ? benchRunEditSchema : benchRunInputSchema;
  const initial = valuesFromRun(from, mode === 'edit');
  const { control, handleSubmit, setError, setValue, getValues, reset, formState } = useForm<RunFormValues>({
    resolver: zodResolver(schema) as unknown as Resolver<RunFormValues>,
    defaultValues: initial,
  });
  const [currentUnit, setCurrentUnit] = useState<'mA' | 'µA'>(initial.currentUa !== undefined ? 'µA' : 'mA');
  const [thrustUnit, setThrustUnit] = useState<'mN' | 'gf'>(initial.thrustGf !== undefined ? 'gf' : 'mN');
  const [saved, setSaved] = useState<string | null>(null);
  // During a sweep the setup stays put: it folds away under a one-line summary once a run exists.
  const [setupOpen, setSetupOpen] = useState(from === undefined || mode === 'edit');
  const polarity = useWatch({ control, name: 'polarity' });
  const photoFileId = useWatch({ control, name: 'photoFileId' });

  // After a run is recorded the form starts again from it, ready for the next point.
  // Keyed on the run's id only: a refetch of the same run must not wipe what is being typed.
  const startFrom = useEffectEvent(() => {
    if (mode !== 'new') return;
    reset(valuesFromRun(from));
    if (from) setSetupOpen(false);
  });
  const fromId = from?.id;
  useEffect(() => startFrom(), [fromId]);

  function switchCurrent(unit: 'mA' | 'µA') {
    const value = getValues(currentUnit === 'mA' ? 'currentMa' : 'currentUa');
    setValue(currentUnit === 'mA' ? 'currentMa' : 'currentUa', undefined);
    if (typeof value === 'number' && Number.isFinite(value)) setValue(unit === 'mA' ? 'currentMa' : 'currentUa', unit === 'mA' ? value / 1000 : value * 1000);
    setCurrentUnit(unit);
  }
  function switchThrust(unit: 'mN' | 'gf') {
    const value = getValues(thrustUnit === 'mN' ? 'thrustMn' : 'thrustGf');
    setValue(thrustUnit === 'mN' ? 'thrustMn' : 'thrustGf', undefined);
    if (typeof value === 'number' && Number.isFinite(value))
      setValue(unit === 'mN' ? 'thrustMn' : 'thrustGf', Number((unit === 'mN' ? value * 9.80665 : value / 9.80665).toPrecision(6)));
    setThrustUnit(unit);
  }
  function stepKv(by: number) {
    const kv = getValues('appliedKv');
    if (typeof kv === 'number' && Number.isFinite(kv)) setValue('appliedKv', Math.max(0.1, Number((kv + by).toFixed(3))));
  }

  const submit = handleSubmit(async (values) => {
    setSaved(null);
    try {
      const run = (await onSubmit(payloadOf(values) as BenchRunInput)) as BenchRun | undefined;
      if (run && mode === 'new')
        setSaved(`Run ${run.number} recorded${run.flags.length > 0 ? ` with ${run.flags.length} ${run.flags.length === 1 ? 'flag' : 'flags'}` : ''}.`);
    } catch (error) {
      applyServerErrors(error, FIELDS, setError);
    }
  });

  const serverMessage = formState.errors.root?.server?.message;
  const setupError = SETUP_FIELDS.some((f) => formState.errors[f] !== undefined);
  const showSetup = setupOpen || setupError;
  return (
    <View style={styles.form} testID={testID}>
      <FormNumberField control={control} name="appliedKv" label="Applied voltage" unit="kV" testID={`${testID}-kv`} />
      <View style={styles.row}>
        <Button label="−1 kV" variant="secondary" onPress={() => stepKv(-1)} testID={`${testID}-kv-down`} />
        <Button label="+1 kV" variant="secondary" onPress={() => stepKv(1)} testID={`${testID}-kv-up`} />
      </View>
      {planPolarity === 'reversible' || (polarity !== undefined && polarity !== planPolarity) ? (
        <SegmentedControl
          label="Polarity"
          options={[
            { value: 'positive', label: 'Positive', testID: `${testID}-positive` },
            { value: 'negative', label: 'Negative', testID: `${testID}-negative` },
          ]}
          value={(polarity ?? 'positive') as 'positive' | 'negative'}
          onChange={(v) => setValue('polarity', v)}
        />
      ) : null}
      <SegmentedControl
        label="Current in"
        options={[
          { value: 'mA', label: 'mA', testID: `${testID}-unit-ma` },
          { value: 'µA', label: 'µA', testID: `${testID}-unit-ua` },
        ]}
        value={currentUnit}
        onChange={switchCurrent}
      />
      {currentUnit === 'mA' ? (
        <FormNumberField control={control} name="currentMa" label="Current" unit="mA" testID={`${testID}-current`} />
      ) : (
        <FormNumberField control={control} name="currentUa" label="Current" unit="µA" testID={`${testID}-current`} />
      )}
      <SegmentedControl
        label="Thrust in"
        options={[
          { value: 'mN', label: 'mN', testID: `${testID}-unit-mn` },
          { value: 'gf', label: 'grams-force', testID: `${testID}-unit-gf` },
        ]}
        value={thrustUnit}
        onChange={switchThrust}
      />
      {thrustUnit === 'mN' ? (
        <FormNumberField control={control} name="thrustMn" label="Thrust" unit="mN" hint="Optional" testID={`${testID}-thrust`} />
      ) : (
        <FormNumberField
          control={control}
          name="thrustGf"
          label="Thrust"
          unit="gf"
          hint="Optional; stored in mN (1 gf = 9.80665 mN)"
          testID={`${testID}-thrust`}
        />
      )}
      <FormNumberField control={control} name="velocityMps" label="Airflow velocity" unit="m/s" hint="Optional" testID={`${testID}-velocity`} />
      <FormTextField control={control} name="notes" label="Notes" multiline testID={`${testID}-notes`} />
      <View style={styles.form}>
        <AppText variant="bodyStrong">Photo of the setup (optional)</AppText>
        <BookingPhotoPicker
          bookingId={bookingId}
          fileId={photoFileId}
          onChange={(id) => setValue('photoFileId', id)}
          subject="the bench setup for this run"
          testID={`${testID}-photo`}
        />
        {formState.errors.photoFileId?.message ? (
          <AppText variant="smallStrong" tone="error">
            {formState.errors.photoFileId.message}
          </AppText>
        ) : null}
      </View>
      {showSetup ? null : (
        <View style={styles.setup} testID={`${testID}-setup-summary`}>
          <AppText variant="small">{setupSummary(from)}</AppText>
          <Button
            label="Change gap, device or ambient"
            variant="secondary"
            icon="chevron-down"
            onPress={() => setSetupOpen(true)}
            testID={`${testID}-setup-open`}
          />
        </View>
      )}
      {showSetup ? (
        <View style={styles.form}>
          <FormNumberField control={control} name="gapMm" label="Electrode gap" unit="mm" testID={`${testID}-gap`} />
          <FormNumberField control={control} name="stages" label="Stages or tap" unit="count" integer hint="Optional" testID={`${testID}-stages`} />
          <AppText variant="bodyStrong">Device</AppText>
          <FormNumberField control={control} name="massG" label="Device mass" unit="g" hint="Optional: for thrust-to-weight" testID={`${testID}-mass`} />
          <FormNumberField
            control={control}
            name="outletAreaCm2"
            label="Outlet area"
            unit="cm²"
            hint="Optional: for the momentum check"
            testID={`${testID}-area`}
          />
          <AppText variant="bodyStrong">Ambient</AppText>
          <AppText variant="small" tone="muted">
            Left empty, each is carried over from the previous run.
          </AppText>
          <FormNumberField control={control} name="temperatureC" label="Temperature" unit="°C" testID={`${testID}-temperature`} />
          <FormNumberField control={control} name="pressureKpa" label="Pressure" unit="kPa" testID={`${testID}-pressure`} />
          <FormNumberField control={control} name="humidityPct" label="Relative humidity" unit="%" testID={`${testID}-humidity`} />
          <AppText variant="bodyStrong">Emitter geometry (optional)</AppText>
          <AppText variant="small" tone="muted">
            Wire radius and coaxial collector radius let the fit compare its onset with Peek&apos;s.
          </AppText>
          <FormNumberField control={control} name="wireRadiusMm" label="Wire radius" unit="mm" testID={`${testID}-wire`} />
          <FormNumberField control={control} name="collectorRadiusMm" label="Collector radius" unit="mm" testID={`${testID}-collector`} />
          <FormNumberField
            control={control}
            name="surfaceFactor"
            label="Surface factor m_v"
            unit="0–1"
            hint="1 smooth wire; 0.98–0.93 rough; 0.87–0.83 stranded"
            testID={`${testID}-surface`}
          />
        </View>
      ) : null}
      {mode === 'edit' ? <FormTextField control={control} name="reason" label="Why the correction" testID={`${testID}-reason`} /> : null}
      {serverMessage ? <FormAlert message={serverMessage} testID={`${testID}-error`} /> : null}
      {saved ? (
        <AppText accessibilityLiveRegion="polite" role="status" testID={`${testID}-saved`}>
          {saved}
        </AppText>
      ) : null}
      <View style={styles.row}>
        <Button
          label={mode === 'edit' ? 'Save correction' : 'Record run'}
          icon={mode === 'edit' ? 'pencil' : 'plus'}
          onPress={() => void submit()}
          loading={formState.isSubmitting}
          loadingLabel="Saving the run"
          block
          testID={`${testID}-submit`}
        />
        {onCancel ? <Button label="Cancel" variant="secondary" onPress={onCancel} testID={`${testID}-cancel`} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.sm },
  row: { flexDirection: 'row', gap: spacing.xs, alignItems: 'flex-end', flexWrap: 'wrap' },
  setup: { gap: spacing.xs },
});
