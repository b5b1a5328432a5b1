export interface SmallPlot {
  label: string;
  /** The status word the plot would show, when a season is open. */
  word: string | null;
}

/** Names the plots too small at this zoom to show their label and status word on the map. */
export function SmallPlotsKey({ plots, canZoom }: { plots: SmallPlot[]; canZoom: boolean }) {
  if (plots.length === 0) return null;
  return (
    <p className="text-sm text-stone">
      Too small to label at this zoom: {plots.map((p) => (p.word ? `${p.label} ${p.word}` : p.label)).join(' · ')}.{' '}
      {canZoom ? 'Zoom in, or select a plot to see it in full.' : 'Select a plot to see it in full.'}
    </p>
  );
}
