// The print views, one chunk on the web (see source.web.ts).
export { DistrictBriefPage } from './district-brief-page';
export { RegionBriefPage } from './region-brief-page';
