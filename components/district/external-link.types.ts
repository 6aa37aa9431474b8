export type ExternalLinkProps = {
  /** A server path such as `/api/briefs/district/D07.pdf`. */
  path: string;
  label: string;
  accessibilityLabel?: string;
  testID?: string;
};
