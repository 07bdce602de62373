import { Image, Linking, StyleSheet, View } from 'react-native';

import { borders, radii, spacing } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { itemUrls } from '@/hooks/use-items';
import type { Item } from '@/shared/schemas/items';

import { formatKv } from './rating-fields';

interface ItemLabelCardProps {
  item: Item;
  /** Managers and officers print labels (the PDF routes are theirs). */
  canPrint: boolean;
}

/** The label as it is printed: the QR code (the item's address) with tag, name and rating beside it. */
export function ItemLabelCard({ item, canPrint }: ItemLabelCardProps) {
  const { colors } = useTheme();
  return (
    <Card title="Label" testID="item-label">
      <View style={[styles.label, { borderColor: colors.borderStrong, backgroundColor: colors.surface }]}>
        {/* The SVG draws its own white ground, so the code stays black on white in the dark theme. */}
        <View style={styles.codeBox}>
          <Image
            source={{ uri: itemUrls.labelSvg(item.id) }}
            style={styles.code}
            resizeMode="contain"
            accessibilityLabel={`QR code for ${item.tag}, opens ${item.labelUrl}`}
            testID="item-label-qr"
          />
        </View>
        <View style={styles.text}>
          <AppText variant="heading">{item.tag}</AppText>
          <AppText>{item.name}</AppText>
          <AppText variant="bodyStrong">{item.ratedKv === null ? formatKv(null) : `Max ${formatKv(item.ratedKv)}`}</AppText>
        </View>
      </View>
      <AppText variant="small" tone="muted" selectable>
        {`The code opens ${item.labelUrl}`}
      </AppText>
      {canPrint ? (
        <Button
          label="Print label"
          icon="printer"
          variant="secondary"
          onPress={() => void Linking.openURL(itemUrls.labelPdf(item.id))}
          testID="item-print-label"
        />
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  label: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, padding: spacing.sm, borderWidth: borders.hairline, borderRadius: radii.md },
  codeBox: { width: '40%' },
  code: { width: '100%', aspectRatio: 1 },
  text: { flex: 1, gap: spacing.xxs },
});
