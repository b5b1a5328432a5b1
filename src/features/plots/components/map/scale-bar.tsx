import { feetToMetres, lengthUnitLabel, type UnitSystem } from '@shared/geometry';
import { niceScaleLength } from './map-math';

/** A scale bar of a round length in the site's units. */
export function ScaleBar({ scale, units }: { scale: number; units: UnitSystem }) {
  const pxPerUnit = units === 'us' ? feetToMetres(1) * scale : scale;
  const len = niceScaleLength(pxPerUnit);
  return (
    <div className="flex items-end gap-2 text-sm text-soil" aria-label={`Scale: the bar is ${len} ${lengthUnitLabel(units)}`}>
      <div className="h-2.5 border-x-2 border-b-2 border-soil" style={{ width: len * pxPerUnit }} aria-hidden="true" />
      <span className="leading-none font-medium">
        {len} {lengthUnitLabel(units)}
      </span>
    </div>
  );
}
