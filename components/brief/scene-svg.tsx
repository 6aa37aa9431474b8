// A brief chart drawn from its vector scene (contracts/briefs.ts) with react-native-svg: the
// same paths, marks and labels the server draws into the PDF. Loaded on its own, after
// the brief has mounted (see brief-chart.tsx).
import Svg, { Circle, Path, Text as SvgText } from 'react-native-svg';

import { mapFill, mapInk } from '@/components/region/map-palette';
import { chartColors, colors, fonts, standingColors } from '@/components/theme';
import type { BriefTone, ChartScene } from '@/contracts/briefs';

const TONE: Record<BriefTone, string> = {
  ink: colors.text,
  muted: colors.textMuted,
  grid: chartColors.grid,
  curve: chartColors.curve,
  pooled: chartColors.pooled,
  band: chartColors.band,
  threshold: chartColors.threshold,
  latest: chartColors.latest,
  point: chartColors.points,
  projection: chartColors.projection,
  approaching: standingColors.approaching,
  at_turn: standingColors.at_turn,
  past_turn: standingColors.past_turn,
  no_turn: standingColors.no_turn,
  not_estimable: standingColors.not_estimable,
  approaching_fill: mapFill.approaching,
  at_turn_fill: mapFill.at_turn,
  past_turn_fill: mapFill.past_turn,
  no_turn_fill: mapFill.no_turn,
  not_estimable_fill: mapFill.not_estimable,
  land: mapInk.hidden,
  sea: colors.surface,
};

export type SceneSvgProps = { scene: ChartScene };

export default function SceneSvg({ scene }: SceneSvgProps) {
  return (
    <Svg width="100%" height="100%" viewBox={`0 0 ${scene.width} ${scene.height}`} preserveAspectRatio="xMidYMid meet">
      {scene.items.map((item, i) => {
        if (item.kind === 'path') {
          return (
            <Path
              key={i}
              d={item.d}
              fill={item.fill ? TONE[item.fill] : 'none'}
              // The theme's band is already a light tint: drawn solid, as on the card.
              fillOpacity={item.fill ? (item.fill === 'band' ? 1 : (item.opacity ?? 1)) : undefined}
              stroke={item.stroke ? TONE[item.stroke] : undefined}
              strokeOpacity={item.stroke ? (item.opacity ?? 1) : undefined}
              strokeWidth={item.stroke ? (item.width ?? 1) : undefined}
              strokeDasharray={item.dash ? `${item.dash[0]} ${item.dash[1]}` : undefined}
              strokeLinecap="round"
              strokeLinejoin="round"
            />
          );
        }
        if (item.kind === 'circle') {
          return (
            <Circle
              key={i}
              cx={item.cx}
              cy={item.cy}
              r={item.r}
              fill={item.fill ? TONE[item.fill] : 'none'}
              fillOpacity={item.opacity ?? 1}
              stroke={item.stroke ? TONE[item.stroke] : undefined}
              strokeWidth={item.stroke ? (item.width ?? 0.6) : undefined}
            />
          );
        }
        return (
          <SvgText
            key={i}
            x={item.x}
            y={item.y}
            fontSize={item.size}
            fontFamily={item.bold ? fonts.bold : fonts.regular}
            fill={TONE[item.tone]}
            textAnchor={item.anchor}
          >
            {item.text}
          </SvgText>
        );
      })}
    </Svg>
  );
}
