// The region's locale for numbers and dates on every screen: the admin setting
// `regionLocale` (BCP 47), which GET /api/me carries. It is set in lib/format.ts before the
// screens below draw; the returned tag keys the tree, so a change draws them again once.
import { useMeQuery } from '@/hooks/use-auth';
import { DEFAULT_LOCALE, setRegionLocale } from '@/lib/format';

export function useRegionLocale(): string {
  const me = useMeQuery();
  const locale = me.data?.regionLocale ?? DEFAULT_LOCALE;
  setRegionLocale(locale);
  return locale;
}
