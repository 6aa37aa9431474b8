// The residual plot's drawing (plain react-native-svg); loaded on its own after mount.
import Svg, { G, Line, Rect, Text as SvgText } from 'react-native-svg';

import { chartColors, fonts } from '@/components/theme';
import type { Diagnostics } from '@/contracts/runs';

export type ResidualPlotSvgProps = {
  residuals: Diagnostics['residualsByYear'];
  width: number;
  height: number;
  /** The reader's text scale: SVG text is sized in px, so labels and their room grow by it. */
  textScale?: number;
};

export default function ResidualPlotSvg({ residuals, width, height, textScale = 1 }: ResidualPlotSvgProps) {
  const fontSize = 11 * textScale;
  const PAD = {
    top: Math.round(12 * textScale),
    right: 12,
    bottom: Math.round(24 * textScale),
    left: Math.round(48 * textScale),
  };
  const max = Math.max(1e-9, ...residuals.map((r) => Math.abs(r.residual)));
  const innerW = Math.max(1, width - PAD.left - PAD.right);
  const innerH = height - PAD.top - PAD.bottom;
  const zero = PAD.top + innerH / 2;
  const step = innerW / Math.max(1, residuals.length);
  const bar = Math.max(2, step * 0.7);
  const scale = (v: number) => (v / max) * (innerH / 2);
  const first = residuals[0]?.year;
  const last = residuals[residuals.length - 1]?.year;
  const label = (v: number) => (v >= 0 ? '+' : '−') + Math.abs(v).toPrecision(2);
  return (
    <Svg width={width} height={height}>
      <Line x1={PAD.left} x2={width - PAD.right} y1={PAD.top} y2={PAD.top} stroke={chartColors.grid} strokeWidth={1} />
      <Line
        x1={PAD.left}
        x2={width - PAD.right}
        y1={PAD.top + innerH}
        y2={PAD.top + innerH}
        stroke={chartColors.grid}
        strokeWidth={1}
      />
      <SvgText
        x={PAD.left - 6}
        y={PAD.top + fontSize / 3}
        fontSize={fontSize}
        fontFamily={fonts.regular}
        fill={chartColors.axis}
        textAnchor="end"
      >
        {label(max)}
      </SvgText>
      <SvgText
        x={PAD.left - 6}
        y={zero + fontSize / 3}
        fontSize={fontSize}
        fontFamily={fonts.regular}
        fill={chartColors.axis}
        textAnchor="end"
      >
        0
      </SvgText>
      <SvgText
        x={PAD.left - 6}
        y={PAD.top + innerH + fontSize / 3}
        fontSize={fontSize}
        fontFamily={fonts.regular}
        fill={chartColors.axis}
        textAnchor="end"
      >
        {label(-max)}
      </SvgText>
      <G>
        {residuals.map((r, i) => {
          const h = scale(r.residual);
          const x = PAD.left + i * step + (step - bar) / 2;
          return (
            <Rect
              key={r.year}
              x={x}
              y={h >= 0 ? zero - h : zero}
              width={bar}
              height={Math.max(1, Math.abs(h))}
              fill={r.residual >= 0 ? chartColors.curve : chartColors.projection}
            />
          );
        })}
      </G>
      <Line x1={PAD.left} x2={width - PAD.right} y1={zero} y2={zero} stroke={chartColors.axis} strokeWidth={1} />
      {first !== undefined ? (
        <SvgText x={PAD.left} y={height - 6} fontSize={fontSize} fontFamily={fonts.regular} fill={chartColors.axis}>
          {first}
        </SvgText>
      ) : null}
      {last !== undefined ? (
        <SvgText
          x={width - PAD.right}
          y={height - 6}
          fontSize={fontSize}
          fontFamily={fonts.regular}
          fill={chartColors.axis}
          textAnchor="end"
        >
          {last}
        </SvgText>
      ) : null}
    </Svg>
  );
}
