import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { StandingMark } from '@/components/region/standing-mark';
import { colors, layout, radius, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { CAUTIONS } from '@/lib/cautions';
import { STANDINGS } from '@/contracts/estimates';
import { SHAPE_LABEL, SHAPE_TECHNICAL, SHAPES_IN_ORDER, STANDING_LABEL, STANDING_MEANING } from '@/lib/estimate-words';

/** How Crestwatch estimates, in plain words with the formulas, the references and the cautions. */
export function MethodView({ showBackLink, sources }: { showBackLink: boolean; sources?: ReactNode }) {
  return (
    // A page of prose with few links: the scrolling region itself takes keyboard focus, so
    // the arrow keys scroll it (axe-core rule scrollable-region-focusable; WCAG 2.2 SC 2.1.1).
    <ScrollView
      style={styles.scroll}
      contentContainerStyle={styles.content}
      testID="method-page"
      tabIndex={0}
      role="region"
      aria-label="How Crestwatch estimates"
    >
      <View style={styles.column}>
        {showBackLink ? <TextLink href="/" label="All districts" leading="← " /> : null}
        <Text role="heading" aria-level={1} style={styles.title}>
          How Crestwatch estimates
        </Text>
        <P>
          For each district Crestwatch fits one curve to its yearly figures: emissions per person against real income
          per person. The question it answers is whether growth has started to come with falling emissions, and if not,
          how far the district is from the income where that tends to happen. The peak of such a curve is its turning
          point; Crestwatch calls it the district’s threshold.
        </P>

        <H2>The curve</H2>
        <P>Every district is fitted the same way, by ordinary least squares, in the published run’s specification:</P>
        <Formula>ln y = b0 + b1·ln x + b2·(ln x)² [+ b3·(ln x)³] + g′·z + e</Formula>
        <P>
          y is emissions per person, x real income per person, z the controls (such as population density). The default
          is a quadratic in logs; a cubic allows up to two turns; the level form uses the raw values. Values of zero or
          below cannot be logged: such rows are reported as input errors, never dropped in silence. The fit uses QR
          decomposition with column pivoting, checked against the NIST StRD linear-regression datasets.
        </P>
        <P>
          Standard errors follow the specification: classical, HC1 or HC3 (MacKinnon and White 1985), or, by default for
          yearly series, Newey–West (Newey and West 1987), which allows for serial correlation. All districts together,
          with district and year fixed effects and district-clustered errors, give the regional pooled curve: the faint
          reference on each card, and the stand-in — labelled “regional substitute” — for a district whose own series is
          too short.
        </P>

        <H2>The threshold and its interval</H2>
        <Formula>x* = −b1 / (2·b2) threshold X* = exp(x*) in real income per person</Formula>
        <P>
          Its uncertainty is shown two ways, side by side. The delta method gives an interval on the log scale, whose
          ends are then exponentiated. Fieller’s interval (Fieller 1954) collects every θ with
        </P>
        <Formula>(b1 + 2·b2·θ)² ≤ t²·(V11 + 4θ·V12 + 4θ²·V22)</Formula>
        <P>
          That set is not always one stretch of incomes. It can be bounded; it can be two rays (everything below one
          income and above another); or it can be the whole line. Where it is not bounded, Crestwatch draws no band and
          says “interval not bounded” at the run’s confidence level, instead of printing a range that does not exist.
        </P>

        <H2>The shape</H2>
        <P>
          The shape is judged over the incomes the district has actually had, not by the signs of b1 and b2 alone. The
          Lind–Mehlum U-test (Lind and Mehlum 2010) asks whether the slope is positive at the lowest observed income and
          negative at the highest (or the reverse for a U). If it does not confirm a turn, a Wald F test asks whether
          income matters at all (if not: flat); otherwise the slope in the middle of the range says rising or falling. A
          turning point outside the observed incomes is kept visible but flagged “turn beyond observed range”. A cubic
          curve can turn twice inside the observed incomes: emissions rise, fall and rise again (N-shaped), or fall,
          rise and fall again (inverted N).
        </P>
        <View style={styles.list}>
          {SHAPES_IN_ORDER.map((s) => (
            <Text key={s} style={styles.item}>
              <Text style={styles.term}>{SHAPE_LABEL[s]}</Text> ({SHAPE_TECHNICAL[s]})
            </Text>
          ))}
        </View>

        <H2>Where a district stands</H2>
        <P>
          The latest income is compared with the threshold’s interval (Fieller’s unless the specification says delta):
        </P>
        <View style={styles.list} testID="method-standings">
          {STANDINGS.map((s) => (
            <View key={s} style={styles.standing}>
              <StandingMark standing={s} size={14} decorative />
              <Text style={styles.item}>
                <Text style={styles.term}>{STANDING_LABEL[s]}: </Text>
                {STANDING_MEANING[s]}
              </Text>
            </View>
          ))}
        </View>
        <P>
          For a U-shaped curve the turn is a low point, so past it emissions rise again with income. A curve that turns
          twice is read from the turn nearest the latest income: a high point reads like a rise then fall, a low point
          like a fall then rise. Where the interval is not bounded, the standing follows the point estimate and says so.
        </P>
        <Formula>gap = 100·(X_now / X* − 1) %</Formula>
        <Formula>elasticity now = b1 + 2·b2·ln x_now</Formula>
        <P>
          The elasticity says how emissions move with 1% more income today. The projected crossing carries the income
          trend of the last ten years forward (the slope g of ln income on year): years to threshold = (x* − x_now)/g,
          with its range from the ends of the interval. When income moves away from the threshold, or an end is
          unbounded, the card says “not on current trend”.
        </P>
        <P>
          Each run also fits four variants — without controls, cubic, the last 20 years only, and the level form — so
          the sensitivity strip on the card shows how much the threshold depends on these choices.
        </P>

        {sources ? (
          <>
            <H2>The series and where they come from</H2>
            <P>
              Crestwatch can watch several indicators at once, each as its own track with its own runs, standings and
              alerts; a run never compares two tracks. Every figure carries the unit the catalogue gives its series.
            </P>
            {sources}
          </>
        ) : null}

        <H2>Read with care</H2>
        <View style={styles.list} testID="method-cautions">
          {CAUTIONS.map((c) => (
            <Text key={c.key} style={styles.item}>
              – {c.full}
            </Text>
          ))}
        </View>

        <H2>The demo region</H2>
        <P>
          The demonstration data are invented: 24 districts with yearly series from 1995 to 2025, drawn from a fixed
          seed. Every shape appears — rise then fall with the turn inside the observed incomes, fall then rise, rising,
          falling, flat, and a turn beyond the observed range — along with two districts whose series start too late for
          a fit of their own (read against the regional substitute) and districts with missing years. Income follows a
          trend plus a random walk; emissions follow a known curve plus serially correlated noise. No name, place or
          number refers to a real district.
        </P>

        <H2>References</H2>
        <View style={styles.list}>
          <Text style={styles.item}>
            Fieller, E. C. (1954). Some problems in interval estimation. Journal of the Royal Statistical Society,
            Series B, 16(2), 175–185.
          </Text>
          <Text style={styles.item}>
            Lind, J. T. and Mehlum, H. (2010). With or without U? The appropriate test for a U-shaped relationship.
            Oxford Bulletin of Economics and Statistics, 72(1), 109–118.
          </Text>
          <Text style={styles.item}>
            Newey, W. K. and West, K. D. (1987). A simple, positive semi-definite, heteroskedasticity and
            autocorrelation consistent covariance matrix. Econometrica, 55(3), 703–708.
          </Text>
          <Text style={styles.item}>
            MacKinnon, J. G. and White, H. (1985). Some heteroskedasticity-consistent covariance matrix estimators with
            improved finite sample properties. Journal of Econometrics, 29(3), 305–325.
          </Text>
          <Text style={styles.item}>
            NIST Statistical Reference Datasets (StRD), linear regression: certified values for checking least-squares
            software.
          </Text>
        </View>
      </View>
    </ScrollView>
  );
}

function H2({ children }: { children: ReactNode }) {
  return (
    <Text role="heading" aria-level={2} style={styles.h2}>
      {children}
    </Text>
  );
}
function P({ children }: { children: ReactNode }) {
  return <Text style={styles.p}>{children}</Text>;
}
function Formula({ children }: { children: ReactNode }) {
  return (
    <View style={styles.formula}>
      <Text style={styles.formulaText}>{children}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.detailMaxWidth, gap: space.md },
  title: { ...type.display, color: colors.text },
  h2: { ...type.title, color: colors.text, marginTop: space.md },
  p: { ...type.body, color: colors.text },
  list: { gap: space.xs },
  item: { ...type.body, color: colors.text, flexShrink: 1 },
  term: { fontFamily: type.bodyStrong.fontFamily },
  standing: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  formula: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  formulaText: { ...type.numeric, color: colors.text },
});
