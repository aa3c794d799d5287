/** Valid request bodies that several API test files send, written once. */
import { fieldBody } from './fixture.ts';

/** POST /api/fields: a small soccer field on `siteId` (`fieldBody`, an outline of about 100 m × 110 m). */
export const newFieldBody = (siteId: number, name: string) =>
  fieldBody(siteId, name, { type: 'Polygon', coordinates: [[[-66.4, 37.7], [-66.399, 37.7], [-66.399, 37.701], [-66.4, 37.701], [-66.4, 37.7]]] });

/** PATCH /api/fields/:id/lines: a full-size soccer layout and a youth one across it, a first save. */
export const linePlanBody = (over: Record<string, unknown> = {}) => ({
  layouts: [
    { layout: 'soccer_full', lengthM: 100, widthM: 64, colour: '#ffffff', alongM: 0, acrossM: 0, rotationDeg: 0 },
    { layout: 'soccer_7v7', lengthM: null, widthM: null, colour: '#1f6fd1', alongM: -24, acrossM: 0, rotationDeg: 90 },
  ],
  paint: { dilutionWaterPerPaint: 1, coats: 1, passes: 2 },
  markerId: null,
  seasonStart: '03-01',
  seasonEnd: '11-30',
  shifts: { '2026': { alongM: 2, acrossM: 0 } },
  version: null,
  ...over,
});
