import { z } from 'zod';

/**
 * Mendstep's own body map: the regions a therapist can tap, their shapes for the SVG map, and the region
 * groupings the clinical rules rely on.
 */

export const bodyViews = ['front', 'back'] as const;
export type BodyView = (typeof bodyViews)[number];

export const sides = ['left', 'right'] as const;
export const sideSchema = z
  .enum(sides, { error: 'Side must be left or right' })
  .describe("The athlete's own left or right, not the viewer's");
export type Side = z.infer<typeof sideSchema>;

export const bodyRegionGroups = ['thigh', 'calf', 'arm', 'other'] as const;
export type BodyRegionGroup = (typeof bodyRegionGroups)[number];

export const bodyRegionIds = [
  'anterior-thigh',
  'lateral-thigh',
  'posterior-thigh',
  'medial-thigh',
  'calf',
  'shin',
  'upper-arm-front',
  'upper-arm-back',
  'forearm',
  'buttock',
  'shoulder',
] as const;
export type BodyRegionId = (typeof bodyRegionIds)[number];

export const bodyRegionIdSchema = z
  .enum(bodyRegionIds, { error: `Region must be one of: ${bodyRegionIds.join(', ')}` })
  .describe('A region id from the body map');

export interface BodyRegion {
  id: BodyRegionId;
  label: string;
  /** The view in which the region is mainly tapped; some regions are drawn in both views. */
  view: BodyView;
  /**
   * Anatomical grouping for the map's menus. Do not use it for clinical rules: medial thigh is grouped
   * with the thigh here but is not a "thigh" region for those rules (see `thighRegionIds`).
   */
  group: BodyRegionGroup;
  isAnteriorThigh: boolean;
}

export const bodyRegions: readonly BodyRegion[] = [
  { id: 'anterior-thigh', label: 'Anterior thigh (quadriceps)', view: 'front', group: 'thigh', isAnteriorThigh: true },
  { id: 'lateral-thigh', label: 'Lateral thigh', view: 'front', group: 'thigh', isAnteriorThigh: false },
  { id: 'posterior-thigh', label: 'Posterior thigh (hamstrings)', view: 'back', group: 'thigh', isAnteriorThigh: false },
  { id: 'medial-thigh', label: 'Medial thigh (adductors)', view: 'front', group: 'thigh', isAnteriorThigh: false },
  { id: 'calf', label: 'Calf', view: 'back', group: 'calf', isAnteriorThigh: false },
  { id: 'shin', label: 'Shin', view: 'front', group: 'other', isAnteriorThigh: false },
  { id: 'upper-arm-front', label: 'Upper arm, front (biceps)', view: 'front', group: 'arm', isAnteriorThigh: false },
  { id: 'upper-arm-back', label: 'Upper arm, back (triceps)', view: 'back', group: 'arm', isAnteriorThigh: false },
  { id: 'forearm', label: 'Forearm', view: 'front', group: 'arm', isAnteriorThigh: false },
  { id: 'buttock', label: 'Buttock (gluteals)', view: 'back', group: 'other', isAnteriorThigh: false },
  { id: 'shoulder', label: 'Shoulder (deltoid)', view: 'front', group: 'arm', isAnteriorThigh: false },
];

/**
 * "Thigh" for the clinical rules is fixed by decisions.md as the anterior, lateral or posterior thigh; the
 * medial thigh (adductors) is deliberately not in it, so keep this list rather than filtering on `group`.
 */
export const thighRegionIds = ['anterior-thigh', 'lateral-thigh', 'posterior-thigh'] as const satisfies readonly BodyRegionId[];

export function isThighRegion(id: BodyRegionId): boolean {
  return (thighRegionIds as readonly BodyRegionId[]).includes(id);
}

export function isAnteriorThighRegion(id: BodyRegionId): boolean {
  return bodyRegionById(id).isAnteriorThigh;
}

export function bodyRegionById(id: BodyRegionId): BodyRegion {
  const region = bodyRegions.find((r) => r.id === id);
  if (!region) throw new RangeError(`Unknown body region: ${id}`);
  return region;
}

// ---------------------------------------------------------------------------------------------------------
// Geometry for the SVG body map: a 100 × 220 box, figure facing the viewer in the front view and facing away
// in the back view. Simple rectangles over one shared silhouette keep the map legible on a tablet and easy
// to hit with an oily finger; anatomical detail would add nothing a therapist needs.

export const bodyMapViewBox = { width: 100, height: 220 } as const;

export type BodyMapPoint = readonly [x: number, y: number];
export type BodyMapShape =
  | { kind: 'rect'; x: number; y: number; width: number; height: number }
  | { kind: 'polygon'; points: readonly BodyMapPoint[] };

export interface BodyMapArea {
  regionId: BodyRegionId;
  side: Side;
  shape: BodyMapShape;
}

export interface BodyMapViewGeometry {
  view: BodyView;
  outline: { head: { cx: number; cy: number; r: number }; body: readonly BodyMapPoint[] };
  areas: readonly BodyMapArea[];
}

/** Right half of the silhouette (x ≥ 50), from the neck round to the crotch; mirrored for the left half. */
const silhouetteRightHalf: readonly BodyMapPoint[] = [
  [55, 24], [55, 28], [68, 29], [76, 31], [80, 37], [81, 120], [82, 131], [74, 133], [72, 121], [71, 46],
  [69, 46], [69, 96], [70, 110], [70, 160], [67, 168], [66, 200], [62, 206], [66, 216], [53, 216], [53, 204],
  [52, 168], [51, 118], [50, 116],
]

function mirrorPoint([x, y]: BodyMapPoint): BodyMapPoint {
  return [bodyMapViewBox.width - x, y];
}

const silhouette: readonly BodyMapPoint[] = [
  ...silhouetteRightHalf,
  ...silhouetteRightHalf.slice(0, -1).map(mirrorPoint).reverse(),
];

function rect(x: number, y: number, width: number, height: number): BodyMapShape {
  return { kind: 'rect', x, y, width, height };
}

function mirrorShape(shape: BodyMapShape): BodyMapShape {
  return shape.kind === 'rect'
    ? { ...shape, x: bodyMapViewBox.width - shape.x - shape.width }
    : { kind: 'polygon', points: shape.points.map(mirrorPoint) };
}

type HalfArea = { regionId: BodyRegionId; shape: BodyMapShape };

// The shoulder follows the slope of the outline; the limbs are strips inside the arm's edges.
const shoulder: BodyMapShape = { kind: 'polygon', points: [[66, 31], [76, 33], [79, 38], [79, 44], [66, 44]] };
const upperArm = rect(71.5, 46, 8, 32);
const forearm = rect(72.5, 82, 7.5, 36);

/** Areas drawn on the viewer's right half of each view; the viewer's left half is their mirror image. */
const viewerRightHalfAreas: Record<BodyView, readonly HalfArea[]> = {
  front: [
    { regionId: 'shoulder', shape: shoulder },
    { regionId: 'upper-arm-front', shape: upperArm },
    { regionId: 'forearm', shape: forearm },
    { regionId: 'medial-thigh', shape: rect(52, 118, 3, 40) },
    { regionId: 'anterior-thigh', shape: rect(55, 116, 10, 42) },
    { regionId: 'lateral-thigh', shape: rect(65, 112, 4, 46) },
    { regionId: 'shin', shape: rect(55, 170, 8, 32) },
  ],
  back: [
    { regionId: 'shoulder', shape: shoulder },
    { regionId: 'upper-arm-back', shape: upperArm },
    { regionId: 'forearm', shape: forearm },
    { regionId: 'buttock', shape: rect(51, 97, 17.5, 17) },
    { regionId: 'posterior-thigh', shape: rect(52, 116, 13, 42) },
    { regionId: 'lateral-thigh', shape: rect(65, 116, 4, 42) },
    { regionId: 'calf', shape: rect(53, 170, 11, 30) },
  ],
};

/**
 * Facing the viewer, the athlete's left is on the viewer's right; seen from behind, the athlete's left is on
 * the viewer's left. Getting this wrong would put a therapist's tap on the wrong leg.
 */
const athleteSideOnViewerRight: Record<BodyView, Side> = { front: 'left', back: 'right' };

function buildView(view: BodyView): BodyMapViewGeometry {
  const onRight = athleteSideOnViewerRight[view];
  const onLeft: Side = onRight === 'left' ? 'right' : 'left';
  const areas = viewerRightHalfAreas[view].flatMap(({ regionId, shape }) => [
    { regionId, side: onRight, shape },
    { regionId, side: onLeft, shape: mirrorShape(shape) },
  ]);
  return { view, outline: { head: { cx: 50, cy: 14, r: 10 }, body: silhouette }, areas };
}

export const bodyMapGeometry: Record<BodyView, BodyMapViewGeometry> = {
  front: buildView('front'),
  back: buildView('back'),
};

/** The `points` attribute of an SVG <polygon>. */
export function toSvgPoints(points: readonly BodyMapPoint[]): string {
  return points.map(([x, y]) => `${x},${y}`).join(' ');
}
