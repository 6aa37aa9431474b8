// The drawn map: one path per standing, one for the borders, the standing marks at each
// district's inside point when the zoom leaves room, zoom (wheel, pinch, buttons), pan
// (drag) and reset; a tap finds the district by point in polygon. Colour is never the
// only cue: each district also carries its standing's mark.
import { useMemo, useRef, useState } from 'react';
import { PanResponder, Platform, Pressable, StyleSheet, Text, View, type GestureResponderEvent } from 'react-native';
import Svg, { G, Path } from 'react-native-svg';

import { colors, radius, space, type } from '@/components/theme';
import type { Standing } from '@/contracts/estimates';
import { districtAt, type MapScene } from '@/lib/map-scene';

import { mapFill, mapInk } from './map-palette';
import { StandingMark } from './standing-mark';

export type MapView = { k: number; tx: number; ty: number };
const IDENTITY: MapView = { k: 1, tx: 0, ty: 0 };
const MAX_ZOOM = 12;
/** A mark needs its district at least this wide on screen (px). */
const MARK_ROOM = 22;

export type MapCanvasProps = {
  scene: MapScene;
  /** standings the legend filter shows (empty: all) */
  shown: Standing[];
  onOpen: (code: string) => void;
  testID?: string;
};

function clampView(v: MapView, w: number, h: number): MapView {
  const k = Math.min(MAX_ZOOM, Math.max(1, v.k));
  const tx = Math.min(0, Math.max(w - w * k, v.tx));
  const ty = Math.min(0, Math.max(h - h * k, v.ty));
  return { k, tx, ty };
}

export function MapCanvas({ scene, shown, onOpen, testID }: MapCanvasProps) {
  const { width: w, height: h } = scene;
  const [view, setView] = useState<MapView>(IDENTITY);
  // The view as last applied, for handlers that run between renders (wheel, drag, press).
  const viewRef = useRef(view);
  const moved = useRef(false);
  /**
   * The gesture in progress: the view when its current phase began (one finger: a drag
   * from `origin`; two: a pinch from the spread `dist` about `mid`), so a pinch that
   * becomes a drag (or back) carries on from where the map is.
   */
  const gesture = useRef<{
    view: MapView;
    fingers: 0 | 1 | 2;
    origin: { x: number; y: number };
    dist: number;
    mid: { x: number; y: number };
  }>({ view: IDENTITY, fingers: 0, origin: { x: 0, y: 0 }, dist: 1, mid: { x: 0, y: 0 } });
  /** Where the last touch or press went down (page coordinates): a drag follows the finger from there. */
  const down = useRef<{ x: number; y: number } | null>(null);
  const frameRef = useRef<View>(null);
  /** The point between two fingers, in the frame's coordinates. */
  const midpoint = (a: { pageX: number; pageY: number }, b: { pageX: number; pageY: number }) => {
    const x = (a.pageX + b.pageX) / 2;
    const y = (a.pageY + b.pageY) / 2;
    const el = frameRef.current as unknown as { getBoundingClientRect?: () => DOMRect } | null;
    if (Platform.OS === 'web' && el?.getBoundingClientRect) {
      const r = el.getBoundingClientRect();
      return { x: x - window.scrollX - r.left, y: y - window.scrollY - r.top };
    }
    return { x: w / 2, y: h / 2 };
  };
  /** A pinch starts: from the view as it is, the fingers' spread and the point between them. */
  const pinchFrom = (a: { pageX: number; pageY: number }, b: { pageX: number; pageY: number }) => {
    const dist = Math.hypot(a.pageX - b.pageX, a.pageY - b.pageY) || 1;
    Object.assign(gesture.current, { fingers: 2, view: viewRef.current, dist, mid: midpoint(a, b) });
  };
  const apply = (v: MapView) => {
    const next = clampView(v, w, h);
    viewRef.current = next;
    setView(next);
  };

  const zoomAt = (factor: number, x: number, y: number) => {
    const v = viewRef.current;
    const k = Math.min(MAX_ZOOM, Math.max(1, v.k * factor));
    const f = k / v.k;
    apply({ k, tx: x - (x - v.tx) * f, ty: y - (y - v.ty) * f });
  };

  const pan = useMemo(
    () =>
      // PanResponder.create only keeps its handlers for later gestures; React's compiler
      // learned this after eslint-plugin-react-hooks 7.1 (react PR 35893), so the rule still
      // reads the refs in the handlers as render-time access.
      // eslint-disable-next-line react-hooks/refs
      PanResponder.create({
        // Notes where a press goes down; a second finger takes the gesture at once (before
        // the tap surface below, in the capture phase), so a pinch starts from the first spread.
        onStartShouldSetPanResponderCapture: (e) => {
          const n = e.nativeEvent;
          const fingers = n.touches?.length ?? 0;
          if (fingers <= 1) down.current = { x: n.pageX, y: n.pageY };
          return fingers > 1;
        },
        onMoveShouldSetPanResponder: (_e, g) => Math.abs(g.dx) + Math.abs(g.dy) > 6 || g.numberActiveTouches > 1,
        onPanResponderGrant: (e) => {
          moved.current = false;
          gesture.current.fingers = 0;
          const t = e.nativeEvent.touches;
          if (t && t.length > 1) pinchFrom(t[0], t[1]);
        },
        onPanResponderMove: (e) => {
          moved.current = true;
          const n = e.nativeEvent;
          const t = n.touches;
          const s = gesture.current;
          if (t && t.length > 1) {
            if (s.fingers !== 2) pinchFrom(t[0], t[1]);
            const dist = Math.hypot(t[0].pageX - t[1].pageX, t[0].pageY - t[1].pageY);
            // Zoom about the point between the fingers where the pinch began.
            const k = Math.min(MAX_ZOOM, Math.max(1, (s.view.k * dist) / s.dist));
            const f = k / s.view.k;
            apply({ k, tx: s.mid.x - (s.mid.x - s.view.tx) * f, ty: s.mid.y - (s.mid.y - s.view.ty) * f });
          } else {
            const p = { x: n.pageX, y: n.pageY };
            if (s.fingers !== 1) {
              // A fresh drag follows the finger from where it went down; after a pinch, from here.
              const origin = s.fingers === 0 && down.current ? down.current : p;
              Object.assign(s, { fingers: 1, view: viewRef.current, origin });
            }
            apply({ ...s.view, tx: s.view.tx + p.x - s.origin.x, ty: s.view.ty + p.y - s.origin.y });
          }
        },
      }),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [w, h],
  );

  // Wheel zoom (web): the View's ref is its DOM element there.
  const wheelRef = useRef<View>(null);
  const attachWheel = (node: View | null) => {
    (wheelRef as { current: View | null }).current = node;
    if (Platform.OS !== 'web' || !node) return;
    const el = node as unknown as HTMLElement;
    if ((el as { __cwWheel?: boolean }).__cwWheel) return;
    (el as { __cwWheel?: boolean }).__cwWheel = true;
    el.addEventListener(
      'wheel',
      (ev: WheelEvent) => {
        ev.preventDefault();
        const r = el.getBoundingClientRect();
        zoomAt(ev.deltaY < 0 ? 1.25 : 0.8, ev.clientX - r.left, ev.clientY - r.top);
      },
      { passive: false },
    );
  };

  const onPress = (e: GestureResponderEvent) => {
    if (moved.current) return;
    const v = viewRef.current;
    let { locationX, locationY } = e.nativeEvent;
    // Web: locationX is relative to the element under the pointer (an SVG path), so use the
    // page position against the frame's box instead.
    const el = frameRef.current as unknown as { getBoundingClientRect?: () => DOMRect } | null;
    if (Platform.OS === 'web' && el?.getBoundingClientRect) {
      const r = el.getBoundingClientRect();
      const ne = e.nativeEvent as unknown as { clientX?: number; clientY?: number; pageX: number; pageY: number };
      locationX = (ne.clientX ?? ne.pageX - window.scrollX) - r.left;
      locationY = (ne.clientY ?? ne.pageY - window.scrollY) - r.top;
    }
    const hit = districtAt(scene, (locationX - v.tx) / v.k, (locationY - v.ty) / v.k);
    if (hit) onOpen(hit.code);
  };

  const on = (s: Standing) => shown.length === 0 || shown.includes(s);
  const marks = scene.districts.filter(
    (d) => (d.box[2] - d.box[0]) * view.k >= MARK_ROOM && (d.box[3] - d.box[1]) * view.k >= MARK_ROOM && on(d.standing),
  );
  const markSize = 12;

  return (
    <View ref={frameRef} style={[styles.frame, { width: w, height: h }]} testID={testID}>
      <View ref={attachWheel} style={[StyleSheet.absoluteFill, styles.gestures]} {...pan.panHandlers}>
        <Pressable
          onPressIn={() => {
            moved.current = false;
          }}
          onPress={onPress}
          style={StyleSheet.absoluteFill}
          accessible={false}
          testID={testID ? `${testID}-surface` : undefined}
        >
          <Svg width={w} height={h} viewBox={`0 0 ${w} ${h}`} aria-hidden>
            <G transform={`translate(${view.tx} ${view.ty}) scale(${view.k})`}>
              {scene.fills.map((f) => (
                <Path
                  key={f.standing}
                  d={f.d}
                  fill={on(f.standing) ? mapFill[f.standing] : mapInk.hidden}
                  fillRule="evenodd"
                  testID={`map-fill-${f.standing}`}
                />
              ))}
              <Path
                d={scene.borders}
                fill="none"
                stroke={mapInk.border}
                strokeWidth={1.2 / view.k}
                strokeLinejoin="round"
              />
              {scene.highlight ? (
                <Path
                  d={scene.highlight}
                  fill="none"
                  stroke={mapInk.highlight}
                  strokeWidth={2.4 / view.k}
                  strokeLinejoin="round"
                />
              ) : null}
            </G>
          </Svg>
          {marks.map((d) => (
            <View
              key={d.code}
              pointerEvents="none"
              style={[
                styles.mark,
                { left: d.x * view.k + view.tx - (markSize + 2) / 2, top: d.y * view.k + view.ty - (markSize + 2) / 2 },
              ]}
              testID={`map-mark-${d.code}`}
            >
              <StandingMark standing={d.standing} size={markSize} decorative />
            </View>
          ))}
        </Pressable>
      </View>
      <View style={styles.zoom}>
        <ZoomButton label="+" a11y="Zoom in" onPress={() => zoomAt(1.5, w / 2, h / 2)} testID="map-zoom-in" />
        <ZoomButton label="−" a11y="Zoom out" onPress={() => zoomAt(1 / 1.5, w / 2, h / 2)} testID="map-zoom-out" />
        <ZoomButton label="⟲" a11y="Reset the map" onPress={() => apply(IDENTITY)} testID="map-reset" />
      </View>
    </View>
  );
}

function ZoomButton({
  label,
  a11y,
  onPress,
  testID,
}: {
  label: string;
  a11y: string;
  onPress: () => void;
  testID: string;
}) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={a11y}
      onPress={onPress}
      style={styles.button}
      testID={testID}
    >
      <Text style={styles.buttonText}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  frame: {
    overflow: 'hidden',
    backgroundColor: mapInk.sea,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.border,
  },
  mark: { position: 'absolute' },
  // Web: the map takes every touch gesture itself (drag pans, two fingers pinch the map, not
  // the page); the page still scrolls from outside the map.
  gestures: Platform.OS === 'web' ? ({ touchAction: 'none' } as object) : {},
  zoom: { position: 'absolute', right: space.sm, top: space.sm, gap: space.xs },
  button: {
    width: 36,
    height: 36,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    alignItems: 'center',
    justifyContent: 'center',
  },
  buttonText: { ...type.bodyStrong, color: colors.text },
});
