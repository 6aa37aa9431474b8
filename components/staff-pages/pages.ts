// Every staff screen, one chunk on the web (see source.web.ts): analysts' and admins' code
// never weighs on the region, the card or the briefs an official opens.
export { AuditPage } from './audit-page';
export { BoundariesPage } from './boundaries-page';
export { MailboxPage } from './mailbox-page';
export { PeoplePage } from './people-page';
export { RunPage } from './run-page';
export { RunsPage } from './runs-page';
export { SettingsPage } from './settings-page';
export { SpecPage } from './spec-page';
export { SpecsPage } from './specs-page';
export { UploadPage } from './upload-page';
export { UploadsPage } from './uploads-page';
