import {
  bodyMapGeometry,
  bodyMapViewBox,
  bodyRegionIds,
  bodyRegions,
  isAnteriorThighRegion,
  isThighRegion,
  toSvgPoints,
  type BodyMapShape,
} from '../../../shared/records/body-map';

function bounds(shape: BodyMapShape) {
  if (shape.kind === 'rect') return { x1: shape.x, y1: shape.y, x2: shape.x + shape.width, y2: shape.y + shape.height };
  const xs = shape.points.map(([x]) => x);
  const ys = shape.points.map(([, y]) => y);
  return { x1: Math.min(...xs), y1: Math.min(...ys), x2: Math.max(...xs), y2: Math.max(...ys) };
}

/** Corners of a shape pulled a hair inwards, so points lying exactly on the outline count as inside. */
function samplePoints(shape: BodyMapShape): [number, number][] {
  if (shape.kind === 'rect') {
    const e = 0.01;
    const { x, y, width: w, height: h } = shape;
    return [[x + e, y + e], [x + w - e, y + e], [x + e, y + h - e], [x + w - e, y + h - e]];
  }
  const cx = shape.points.reduce((sum, [x]) => sum + x, 0) / shape.points.length;
  const cy = shape.points.reduce((sum, [, y]) => sum + y, 0) / shape.points.length;
  return shape.points.map(([x, y]) => [x + (cx - x) * 0.01, y + (cy - y) * 0.01]);
}

function insidePolygon([px, py]: [number, number], polygon: readonly (readonly [number, number])[]): boolean {
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i, i += 1) {
    const [xi, yi] = polygon[i];
    const [xj, yj] = polygon[j];
    if (yi > py !== yj > py && px < ((xj - xi) * (py - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

describe('body map regions', () => {
  it('lists each region id once, in kebab case', () => {
    expect(bodyRegions.map((r) => r.id)).toEqual([...bodyRegionIds]);
    for (const id of bodyRegionIds) expect(id).toMatch(/^[a-z]+(-[a-z]+)*$/);
  });

  it('treats anterior, lateral and posterior thigh as thigh, but not the medial thigh', () => {
    // decisions.md: "Thigh" = anterior, lateral or posterior thigh regions
    expect(bodyRegionIds.filter(isThighRegion)).toEqual(['anterior-thigh', 'lateral-thigh', 'posterior-thigh']);
  });

  it('marks only the anterior thigh for knee-flexion grading', () => {
    // decisions.md: grading by knee flexion applies to the anterior (quadriceps) region
    expect(bodyRegionIds.filter(isAnteriorThighRegion)).toEqual(['anterior-thigh']);
  });
});

describe('body map geometry', () => {
  it('draws every region on both sides in its main view', () => {
    for (const region of bodyRegions) {
      const sidesDrawn = bodyMapGeometry[region.view].areas.filter((a) => a.regionId === region.id).map((a) => a.side);
      expect(sidesDrawn.sort()).toEqual(['left', 'right']);
    }
  });

  it('keeps every shape inside the 100 × 220 box', () => {
    for (const view of Object.values(bodyMapGeometry)) {
      for (const area of view.areas) {
        const b = bounds(area.shape);
        expect(b.x1).toBeGreaterThanOrEqual(0);
        expect(b.y1).toBeGreaterThanOrEqual(0);
        expect(b.x2).toBeLessThanOrEqual(bodyMapViewBox.width);
        expect(b.y2).toBeLessThanOrEqual(bodyMapViewBox.height);
      }
    }
  });

  it('draws every tap area inside the body outline', () => {
    for (const view of Object.values(bodyMapGeometry)) {
      for (const area of view.areas) {
        for (const point of samplePoints(area.shape)) {
          expect(insidePolygon(point, view.outline.body), `${view.view} ${area.side} ${area.regionId} at ${point}`).toBe(true);
        }
      }
    }
  });

  it('never overlaps two tap areas in the same view', () => {
    for (const view of Object.values(bodyMapGeometry)) {
      const boxes = view.areas.map((a) => ({ label: `${a.side} ${a.regionId}`, ...bounds(a.shape) }));
      for (let i = 0; i < boxes.length; i += 1) {
        for (let j = i + 1; j < boxes.length; j += 1) {
          const [a, b] = [boxes[i], boxes[j]];
          const overlap = a.x1 < b.x2 && b.x1 < a.x2 && a.y1 < b.y2 && b.y1 < a.y2;
          expect(overlap, `${view.view}: ${a.label} overlaps ${b.label}`).toBe(false);
        }
      }
    }
  });

  it("puts the athlete's left on the viewer's right from the front and on the viewer's left from behind", () => {
    // Common practice: anatomical figures face the viewer in a front view
    const centreX = (view: 'front' | 'back') => {
      const area = bodyMapGeometry[view].areas.find((a) => a.regionId === 'lateral-thigh' && a.side === 'left')!;
      const b = bounds(area.shape);
      return (b.x1 + b.x2) / 2;
    };
    expect(centreX('front')).toBeGreaterThan(bodyMapViewBox.width / 2);
    expect(centreX('back')).toBeLessThan(bodyMapViewBox.width / 2);
  });

  it('gives a closed, symmetric silhouette as SVG points', () => {
    const body = bodyMapGeometry.front.outline.body;
    const xs = body.map(([x]) => x);
    expect(Math.min(...xs) + Math.max(...xs)).toBe(bodyMapViewBox.width);
    expect(toSvgPoints(body.slice(0, 2))).toBe('55,24 55,28');
  });
});
