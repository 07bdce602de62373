// A small scatter chart drawn with react-native-svg, scales from d3-scale and curves from
// d3-shape. Series differ by marker shape and are named in the legend, never by colour alone.
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';

import { spacing, typeScale } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { AppText } from '@/components/ui/app-text';

import type { ChartModel } from './chart-data';

const HEIGHT = 240;
const MARGIN = { top: 12, right: 16, bottom: 44, left: 56 };
const SHAPES = ['circle', 'square', 'triangle', 'diamond'] as const;
const SHAPE_WORDS = { circle: 'circles', square: 'squares', triangle: 'triangles', diamond: 'diamonds' } as const;
const R = 5;

/** Flagged runs are drawn hollow: the reading is in doubt. */
function Marker({ shape, x, y, color, hollow }: { shape: (typeof SHAPES)[number]; x: number; y: number; color: string; hollow: boolean }) {
  const paint = hollow ? { fill: 'none', stroke: color, strokeWidth: 2 } : { fill: color };
  if (shape === 'circle') return <Circle cx={x} cy={y} r={R} {...paint} />;
  if (shape === 'square') return <Rect x={x - R} y={y - R} width={2 * R} height={2 * R} {...paint} />;
  if (shape === 'triangle') return <Path d={`M${x},${y - R - 1} L${x + R + 1},${y + R} L${x - R - 1},${y + R} Z`} {...paint} />;
  return <Path d={`M${x},${y - R - 1} L${x + R + 1},${y} L${x},${y + R + 1} L${x - R - 1},${y} Z`} {...paint} />;
}

export function ScatterChart({ model, testID }: { model: ChartModel; testID: string }) {
  const { colors } = useTheme();
  const [width, setWidth] = useState(320);
  const palette = [colors.primary, colors.text, colors.textMuted, colors.primary];
  const xs = model.series.flatMap((s) => [...s.points.map((p) => p.x), ...(s.curve ?? []).map((p) => p.x), ...(s.markX ? [s.markX.x] : [])]);
  const ys = model.series.flatMap((s) => [...s.points.map((p) => p.y), ...(s.curve ?? []).map((p) => p.y)]);
  if (xs.length === 0) return null;
  const x = scaleLinear()
    .domain([Math.min(0, ...xs), Math.max(...xs)])
    .nice()
    .range([MARGIN.left, width - MARGIN.right]);
  const y = scaleLinear()
    .domain([0, Math.max(...ys, 1e-9)])
    .nice()
    .range([HEIGHT - MARGIN.bottom, MARGIN.top]);
  const path = line<{ x: number; y: number }>()
    .x((p) => x(p.x))
    .y((p) => y(p.y));
  const font = typeScale.small.fontSize - 3;
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.max(240, Math.round(e.nativeEvent.layout.width)));

  return (
    <View onLayout={onLayout} testID={testID} style={styles.wrap}>
      {/* The picture is described by the summary and table beside it; screen readers skip it. */}
      <View accessibilityElementsHidden importantForAccessibility="no-hide-descendants" aria-hidden>
        <Svg width={width} height={HEIGHT}>
          <G>
            {(model.xTicks ?? x.ticks(6).map((t) => ({ x: t, label: String(t) }))).map((t) => (
              <G key={`x${t.x}`}>
                <Line x1={x(t.x)} x2={x(t.x)} y1={MARGIN.top} y2={HEIGHT - MARGIN.bottom} stroke={colors.border} strokeWidth={1} />
                <SvgText x={x(t.x)} y={HEIGHT - MARGIN.bottom + 16} fontSize={font} fill={colors.textMuted} textAnchor="middle">
                  {t.label}
                </SvgText>
              </G>
            ))}
            {y.ticks(5).map((t) => (
              <G key={`y${t}`}>
                <Line x1={MARGIN.left} x2={width - MARGIN.right} y1={y(t)} y2={y(t)} stroke={colors.border} strokeWidth={1} />
                <SvgText x={MARGIN.left - 6} y={y(t) + 4} fontSize={font} fill={colors.textMuted} textAnchor="end">
                  {String(t)}
                </SvgText>
              </G>
            ))}
            <SvgText x={(MARGIN.left + width - MARGIN.right) / 2} y={HEIGHT - 6} fontSize={font} fill={colors.text} textAnchor="middle">
              {model.xLabel}
            </SvgText>
            <SvgText
              x={14}
              y={(MARGIN.top + HEIGHT - MARGIN.bottom) / 2}
              fontSize={font}
              fill={colors.text}
              textAnchor="middle"
              transform={`rotate(-90 14 ${(MARGIN.top + HEIGHT - MARGIN.bottom) / 2})`}
            >
              {model.yLabel}
            </SvgText>
          </G>
          {model.series.map((s, i) => {
            const color = palette[i % palette.length]!;
            const shape = SHAPES[i % SHAPES.length]!;
            return (
              <G key={s.key}>
                {s.curve ? <Path d={path(s.curve) ?? ''} stroke={color} strokeWidth={2} fill="none" /> : null}
                {s.markX ? (
                  <G>
                    <Line
                      x1={x(s.markX.x)}
                      x2={x(s.markX.x)}
                      y1={MARGIN.top}
                      y2={HEIGHT - MARGIN.bottom}
                      stroke={color}
                      strokeWidth={1.5}
                      strokeDasharray="5 4"
                    />
                    <SvgText x={x(s.markX.x) + 3} y={MARGIN.top + 12 + i * 14} fontSize={font} fill={color}>
                      {s.markX.label}
                    </SvgText>
                  </G>
                ) : null}
                {s.points.map((p) => (
                  <Marker key={p.run} shape={shape} x={x(p.x)} y={y(p.y)} color={color} hollow={p.flagged} />
                ))}
              </G>
            );
          })}
        </Svg>
      </View>
      <View style={styles.legend}>
        {model.series.map((s, i) => (
          <AppText key={s.key} variant="small">
            {`${s.label}: ${SHAPE_WORDS[SHAPES[i % SHAPES.length]!]}${s.curve ? ', fitted curve as a line' : ''}${s.markX ? ', V₀ as a dashed line' : ''}${s.points.some((p) => p.flagged) ? '; hollow where the run is flagged' : ''}`}
          </AppText>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, alignSelf: 'stretch' },
  legend: { gap: spacing.xxs },
});
