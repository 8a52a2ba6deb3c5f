import { useId, useRef, type KeyboardEvent } from 'react';
import {
  bodyMapGeometry,
  bodyMapViewBox,
  bodyRegionById,
  bodyRegions,
  bodyViews,
  sides,
  toSvgPoints,
  type BodyMapArea,
  type BodyRegionId,
  type BodyView,
  type Side,
} from '../../../../shared/records/body-map';

export interface BodySite {
  region: BodyRegionId;
  side: Side;
}

const sideWord: Record<Side, string> = { left: 'left', right: 'right' };
export const siteLabel = (site: BodySite) => `${bodyRegionById(site.region).label}, ${sideWord[site.side]}`;

const viewTitle: Record<BodyView, string> = { front: 'Front', back: 'Back' };
/** Which of the athlete's sides is on the viewer's left, so the map can say so at its edges. */
const athleteSideOnViewerLeft: Record<BodyView, Side> = { front: 'right', back: 'left' };

// Areas in reading order (top to bottom, then left to right) so arrow keys move the way the eye does.
const orderedAreas: { view: BodyView; area: BodyMapArea }[] = bodyViews.flatMap((view) =>
  [...bodyMapGeometry[view].areas]
    .sort((a, b) => topOf(a) - topOf(b) || leftOf(a) - leftOf(b))
    .map((area) => ({ view, area })),
);

function topOf(area: BodyMapArea) {
  return area.shape.kind === 'rect' ? area.shape.y : Math.min(...area.shape.points.map(([, y]) => y));
}
function leftOf(area: BodyMapArea) {
  return area.shape.kind === 'rect' ? area.shape.x : Math.min(...area.shape.points.map(([x]) => x));
}

/** Shoulder, forearm and lateral thigh are drawn in both views; their names say which view, so no two radios share a name. */
const drawnInBothViews = new Set(
  bodyMapGeometry.front.areas.map((a) => a.regionId).filter((id) => bodyMapGeometry.back.areas.some((b) => b.regionId === id)),
);

const isSame = (a: BodySite | null, b: BodySite) => a !== null && a.region === b.region && a.side === b.side;

/**
 * Mendstep's body map: front and back side by side, every region a radio in one group (click, tap, or arrow
 * keys and Space). The choice is shown three ways — a hatched fill, a thick outline and the label printed
 * under the map — and the selects below offer the same choice with targets large enough for any finger.
 */
export function BodyMapPicker({ value, onChange, error, errorId }: { value: BodySite | null; onChange: (site: BodySite) => void; error?: string; errorId?: string }) {
  const shapeRefs = useRef<(SVGElement | null)[]>([]);
  const regionSelectId = useId();
  const selectedIndex = orderedAreas.findIndex(({ area }) => isSame(value, { region: area.regionId, side: area.side }));
  const tabStop = selectedIndex >= 0 ? selectedIndex : 0;

  const choose = (index: number) => {
    const { area } = orderedAreas[index];
    onChange({ region: area.regionId, side: area.side });
  };

  const onKeyDown = (event: KeyboardEvent<SVGElement>, index: number) => {
    const step = { ArrowRight: 1, ArrowDown: 1, ArrowLeft: -1, ArrowUp: -1 }[event.key];
    if (step) {
      event.preventDefault();
      const next = (index + step + orderedAreas.length) % orderedAreas.length;
      shapeRefs.current[next]?.focus();
      choose(next);
    } else if (event.key === ' ' || event.key === 'Enter') {
      event.preventDefault();
      choose(index);
    }
  };

  return (
    <div className="flex flex-col gap-3">
      <div
        role="radiogroup"
        aria-label="Injury site on the body map"
        aria-invalid={error ? true : undefined}
        aria-describedby={error && errorId ? errorId : undefined}
        className={`flex justify-center gap-4 rounded-xl border-2 bg-paper p-3 ${error ? 'border-ember-600' : 'border-transparent'}`}
      >
        {bodyViews.map((view) => {
          const geometry = bodyMapGeometry[view];
          const leftSide = athleteSideOnViewerLeft[view];
          return (
            <figure key={view} className="flex flex-col items-center gap-1">
              <figcaption className="text-sm font-semibold">{viewTitle[view]}</figcaption>
              <div className="flex items-center gap-1 text-xs font-medium text-ink-muted">
                <span aria-hidden className="w-10 text-right">{leftSide === 'left' ? 'Left' : 'Right'}</span>
                <svg
                  role="group"
                  aria-label={`${viewTitle[view]} view`}
                  viewBox={`0 0 ${bodyMapViewBox.width} ${bodyMapViewBox.height}`}
                  className="h-[min(60vh,460px)] min-h-[320px] w-auto touch-manipulation"
                >
                  <defs>
                    <pattern id={`hatch-${view}`} width="3" height="3" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
                      <rect width="3" height="3" fill="#2a6fb0" />
                      <line x1="0" y1="0" x2="0" y2="3" stroke="#eaf3fb" strokeWidth="1.2" />
                    </pattern>
                  </defs>
                  <circle {...geometry.outline.head} fill="#ece8dc" stroke="#58716d" strokeWidth="0.6" aria-hidden />
                  <polygon points={toSvgPoints(geometry.outline.body)} fill="#ece8dc" stroke="#58716d" strokeWidth="0.6" aria-hidden />
                  {orderedAreas.map(({ view: areaView, area }, index) => {
                    if (areaView !== view) return null;
                    const site = { region: area.regionId, side: area.side };
                    const selected = isSame(value, site);
                    const common = {
                      ref: (el: SVGElement | null) => {
                        shapeRefs.current[index] = el;
                      },
                      role: 'radio',
                      'aria-checked': selected,
                      'aria-label': drawnInBothViews.has(area.regionId) ? `${siteLabel(site)}, ${view} view` : siteLabel(site),
                      tabIndex: index === tabStop ? 0 : -1,
                      onClick: () => choose(index),
                      onKeyDown: (event: KeyboardEvent<SVGElement>) => onKeyDown(event, index),
                      fill: selected ? `url(#hatch-${view})` : '#d5eadf',
                      stroke: selected ? '#12332f' : '#2f7d5b',
                      strokeWidth: selected ? 1.6 : 0.5,
                      className: `cursor-pointer outline-none focus-visible:stroke-[#2a6fb0] focus-visible:[stroke-width:2] ${selected ? '' : 'hover:fill-[#a8d4bd]'}`,
                      'data-region': area.regionId,
                      'data-side': area.side,
                    };
                    return area.shape.kind === 'rect' ? (
                      <rect key={`${area.regionId}-${area.side}`} x={area.shape.x} y={area.shape.y} width={area.shape.width} height={area.shape.height} rx="1" {...common} />
                    ) : (
                      <polygon key={`${area.regionId}-${area.side}`} points={toSvgPoints(area.shape.points)} {...common} />
                    );
                  })}
                </svg>
                <span aria-hidden className="w-10">{leftSide === 'left' ? 'Right' : 'Left'}</span>
              </div>
            </figure>
          );
        })}
      </div>
      <p className="text-base" aria-live="polite">
        <span className="font-medium">Chosen site: </span>
        <span className="font-semibold" data-testid="chosen-site">
          {value ? siteLabel(value) : 'none yet — tap a region or choose below'}
        </span>
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={regionSelectId} className="text-sm font-medium">
            Site
          </label>
          <select
            id={regionSelectId}
            className="min-h-target rounded-lg border border-ink/30 bg-paper-raised px-3 py-2"
            value={value?.region ?? ''}
            onChange={(event) => onChange({ region: event.target.value as BodyRegionId, side: value?.side ?? 'left' })}
          >
            <option value="" disabled>
              Choose a region
            </option>
            {bodyRegions.map((region) => (
              <option key={region.id} value={region.id}>
                {region.label}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-sm font-medium">Side (the athlete&rsquo;s own)</legend>
          <div className="flex gap-2">
            {sides.map((side) => (
              <label key={side} className={`inline-flex min-h-target min-w-[5.5rem] cursor-pointer items-center justify-center gap-2 rounded-lg border px-3 font-medium has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide-500 ${value?.side === side ? 'border-ink bg-ink text-paper' : 'border-ink/30 bg-paper-raised'}`}>
                <input
                  type="radio"
                  name="body-map-side"
                  value={side}
                  className="sr-only"
                  checked={value?.side === side}
                  disabled={!value}
                  onChange={() => value && onChange({ region: value.region, side })}
                />
                {side === 'left' ? 'Left' : 'Right'}
              </label>
            ))}
          </div>
        </fieldset>
      </div>
    </div>
  );
}
