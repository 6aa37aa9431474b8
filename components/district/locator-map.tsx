// The card's small locator map: every district of the region in a quiet fill, this one in
// its standing's colour and outlined, from the same scene as the region map.
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Path } from 'react-native-svg';

import { mapFill, mapInk } from '@/components/region/map-palette';
import { colors, radius, space, type } from '@/components/theme';
import { useBoundariesQuery } from '@/hooks/use-boundaries';
import type { Standing } from '@/contracts/estimates';
import { buildMapScene, mapAspect } from '@/lib/map-scene';
import { formatCount } from '@/lib/format';

export type LocatorMapProps = {
  code: string;
  name: string;
  standing: Standing;
  /** Most width the locator takes. */
  maxWidth?: number;
};

export function LocatorMap({ code, name, standing, maxWidth = 160 }: LocatorMapProps) {
  const boundaries = useBoundariesQuery();
  const [width, setWidth] = useState(0);
  const fc = boundaries.data;
  const w = Math.min(width, maxWidth);
  const h = fc && fc.features.length ? Math.round(w * mapAspect(fc)) : 0;
  const scene = useMemo(
    () =>
      fc && fc.features.length && w > 0
        ? buildMapScene({
            collection: fc,
            standingOf: (c) => (c === code ? standing : 'not_estimable'),
            width: w,
            height: h,
            pad: 4,
            highlight: code,
          })
        : null,
    [fc, w, h, code, standing],
  );
  const has = fc?.features.some((f) => f.properties.code === code) ?? false;
  if (fc && (!fc.features.length || !has)) return null;
  const area = fc?.features.find((f) => f.properties.code === code)?.properties.areaKm2;
  return (
    <View
      style={styles.wrap}
      onLayout={(e: LayoutChangeEvent) => setWidth(Math.floor(e.nativeEvent.layout.width))}
      testID="locator-map"
    >
      {scene ? (
        <View
          style={[styles.frame, { width: w, height: h }]}
          aria-label={`Where ${name} lies in the region`}
          role="img"
        >
          <Svg width={w} height={h} viewBox={`0 0 ${w} ${h}`}>
            {scene.fills.map((f) => (
              <Path
                key={f.standing}
                d={f.d}
                fill={f.standing === standing && f.count === 1 && scene.highlight ? mapFill[standing] : mapInk.hidden}
                fillRule="evenodd"
              />
            ))}
            <Path d={scene.borders} fill="none" stroke={mapInk.border} strokeWidth={0.8} />
            {scene.highlight ? (
              <Path d={scene.highlight} fill={mapFill[standing]} stroke={mapInk.highlight} strokeWidth={1.6} />
            ) : null}
          </Svg>
        </View>
      ) : (
        <View style={{ height: 120 }} />
      )}
      {area !== undefined ? (
        <Text style={styles.caption}>{`Land area ${formatCount(Math.round(area))} km²`}</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, width: '100%', maxWidth: 200 },
  frame: {
    backgroundColor: mapInk.sea,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.border,
    overflow: 'hidden',
  },
  caption: { ...type.caption, color: colors.textMuted },
});
