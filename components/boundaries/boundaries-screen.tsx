import { Page, Section } from '@/components/layout/page';
import type { QueryState } from '@/components/state/query-state';
import type { PickedFile } from '@/lib/pick-file.types';
import type {
  BoundaryRevertAnswer,
  BoundaryUploadAnswer,
  BoundaryUploadOptions,
  BoundaryVersions as Versions,
} from '@/contracts/boundaries';

import { BoundaryUploadPanel } from './boundary-upload-panel';
import { BoundaryVersions } from './boundary-versions';

export type BoundariesScreenProps = {
  versions: QueryState<Versions>;
  pickFile: () => Promise<PickedFile | null>;
  onSend: (file: PickedFile, options: BoundaryUploadOptions) => Promise<BoundaryUploadAnswer>;
  onRevert: (id: number) => Promise<BoundaryRevertAnswer>;
};

/** Load district boundaries from GeoJSON (check, then load the whole file) and the versions history with Revert. */
export function BoundariesScreen({ versions, pickFile, onSend, onRevert }: BoundariesScreenProps) {
  return (
    <Page
      title="District boundaries"
      intro="The region map draws the districts from these boundaries. Every feature is checked before anything is written; a file loads whole or not at all, and any version can be reverted."
      testID="boundaries-screen"
    >
      <Section title="Load a boundary file">
        <BoundaryUploadPanel pickFile={pickFile} onSend={onSend} />
      </Section>
      <Section title="Boundary versions">
        <BoundaryVersions versions={versions} onRevert={onRevert} />
      </Section>
    </Page>
  );
}
