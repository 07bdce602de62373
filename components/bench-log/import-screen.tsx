import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { BackLink } from '@/components/bookings/back-link';
import { canPickFiles, pickFile } from '@/components/items/pick-file';
import { spacing } from '@/components/theme/tokens';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { describeError } from '@/components/ui/error-state';
import { FormAlert } from '@/components/ui/form-alert';
import { Screen } from '@/components/ui/screen';
import { Table, TableCell, TableRow, type TableColumn } from '@/components/ui/table';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/hooks/api-client';
import { useImportRunsMutation } from '@/hooks/use-bench-runs';
import { CSV_FIELDS, type CsvField } from '@/shared/schemas/bench-runs';
import { CSV_HEADERS, csvRowsToRuns, guessMapping, parseCsv } from '@/shared/schemas/bench-runs-csv';

import { currentText, sig } from './run-figures';

const REQUIRED: CsvField[] = ['appliedKv', 'gapMm'];

/**
 * A bench logger's CSV in three steps: the file (picked or pasted), which column is which (a
 * first guess from the headers), and a preview of every row as it will be recorded — or why it
 * cannot be. One refused row refuses the file; the server checks again and imports all or none.
 */
export function BenchImportScreen({ id }: { id: number }) {
  const router = useRouter();
  const importRuns = useImportRunsMutation(id);
  const [csv, setCsv] = useState('');
  const [mapping, setMapping] = useState<Partial<Record<CsvField, string>>>({});
  const parsed = useMemo(() => (csv.trim() === '' ? null : parseCsv(csv)), [csv]);
  const outcomes = useMemo(() => (parsed ? csvRowsToRuns(parsed, mapping) : []), [parsed, mapping]);
  const refused = outcomes.filter((o) => o.input === null);
  const hasCurrent = Boolean(mapping.currentMa || mapping.currentUa);
  const ready = parsed !== null && parsed.rows.length > 0 && REQUIRED.every((f) => mapping[f]) && hasCurrent && refused.length === 0;

  function takeText(text: string) {
    setCsv(text);
    const next = parseCsv(text);
    setMapping(guessMapping(next.headers));
    importRuns.reset();
  }

  async function chooseFile() {
    const file = await pickFile('.csv,text/csv,text/plain');
    if (file) takeText(await file.text());
  }

  const headerChoices = (parsed?.headers ?? []).map((h, i) => ({ value: `c${i}`, label: h || `Column ${i + 1}` }));
  const choiceOf = (field: CsvField) => {
    const index = parsed?.headers.indexOf(mapping[field] ?? '\u0000') ?? -1;
    return index >= 0 ? `c${index}` : 'none';
  };
  const columns: TableColumn[] = [
    { key: 'line', label: 'Line', flex: 1, numeric: true },
    { key: 'run', label: 'As recorded', flex: 5 },
  ];
  const serverFailures = isApiError(importRuns.error) ? (importRuns.error.failures ?? []) : [];

  return (
    <Screen testID="bench-import-screen" title={`Import runs, booking ${id}`}>
      <BackLink href={`/bookings/${id}/runs`} label="Bench log" />
      <Card title="1. The file">
        {canPickFiles ? (
          <Button label="Choose a CSV file" icon="upload" variant="secondary" onPress={() => void chooseFile()} testID="bench-import-pick" />
        ) : null}
        <TextField label="Or paste the CSV text" value={csv} onChangeText={takeText} multiline numberOfLines={6} testID="bench-import-text" />
        {parsed?.problems.map((p) => (
          <AppText key={p} tone="error" variant="small">
            {p}
          </AppText>
        ))}
        {parsed ? <AppText variant="small">{`${parsed.rows.length} rows, ${parsed.headers.length} columns.`}</AppText> : null}
      </Card>
      {parsed ? (
        <Card title="2. Which column is which" testID="bench-import-mapping">
          <AppText variant="small" tone="muted">
            Voltage, current (mA or µA) and gap are needed; the rest is optional. Thrust may be in mN or grams-force.
          </AppText>
          {CSV_FIELDS.map((field) => (
            <ChoiceChips
              key={field}
              label={CSV_HEADERS[field]}
              choices={[{ value: 'none', label: 'Not in the file' }, ...headerChoices]}
              value={choiceOf(field)}
              onChange={(value) => {
                const header = value === 'none' ? undefined : parsed.headers[Number(value.slice(1))];
                setMapping((m) => ({ ...m, [field]: header }));
              }}
              testID={`bench-import-map-${field}`}
            />
          ))}
        </Card>
      ) : null}
      {parsed && parsed.rows.length > 0 ? (
        <Card title="3. Preview" testID="bench-import-preview">
          <AppText testID="bench-import-verdict" tone={refused.length > 0 ? 'error' : 'default'}>
            {refused.length > 0
              ? `${refused.length} of ${outcomes.length} rows cannot be read; nothing will be imported until every row can.`
              : `${outcomes.length} rows ready to record, in file order.`}
          </AppText>
          <Table label="Rows as they will be recorded" columns={columns} testID="bench-import-rows">
            {outcomes.map((o) => (
              <TableRow key={o.line} testID={`bench-import-line-${o.line}`}>
                <TableCell column={columns[0]!}>
                  <AppText variant="small">{String(o.line)}</AppText>
                </TableCell>
                <TableCell column={columns[1]!}>
                  {o.input ? (
                    <AppText variant="small">
                      {`${sig(o.input.appliedKv)} kV · ${currentText({ currentMa: o.input.currentMa ?? (o.input.currentUa ?? 0) / 1000, currentUnit: o.input.currentUa !== undefined ? 'µA' : 'mA' })} · ${sig(o.input.gapMm)} mm${o.input.thrustMn !== undefined ? ` · ${sig(o.input.thrustMn)} mN` : o.input.thrustGf !== undefined ? ` · ${sig(o.input.thrustGf)} gf` : ''}`}
                    </AppText>
                  ) : (
                    o.errors.map((e) => (
                      <AppText key={e} variant="small" tone="error">
                        {e}
                      </AppText>
                    ))
                  )}
                </TableCell>
              </TableRow>
            ))}
          </Table>
          {importRuns.isError ? <FormAlert message={describeError(importRuns.error)} testID="bench-import-error" /> : null}
          {serverFailures.slice(0, 20).map((f, i) => (
            <AppText key={`${f.rule}-${i}`} variant="small" tone="error">
              {f.message}
            </AppText>
          ))}
          <Button
            label={`Import ${outcomes.length} runs`}
            icon="upload"
            disabled={!ready}
            loading={importRuns.isPending}
            loadingLabel="Importing the runs"
            onPress={() => importRuns.mutate({ csv, mapping }, { onSuccess: () => router.replace(`/bookings/${id}/runs`) })}
            block
            testID="bench-import-submit"
          />
        </Card>
      ) : null}
      <View style={styles.spacer} />
    </Screen>
  );
}

const styles = StyleSheet.create({ spacer: { height: spacing.lg } });
