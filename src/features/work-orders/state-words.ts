import type { WorkOrderState } from '@shared/schemas/work-orders';

/**
 * How a state reads and looks. Our own words and marks; every tint is a light one from the palette
 * with ink text on it, and each state also carries its own mark, so colour is never the only cue.
 */
export const STATE_LOOK: Record<WorkOrderState, { mark: string; chip: string; fill: string; stroke: string; meaning: string }> = {
  draft: { mark: '○', chip: 'bg-paper-sunk border-ink/30 border-dashed', fill: '#ebe9e2', stroke: '#566270', meaning: 'Being written; nothing is booked yet.' },
  planned: { mark: '◇', chip: 'bg-tide-light border-tide/50', fill: '#ccfbf1', stroke: '#0b655e', meaning: 'Plan submitted; waiting for the window.' },
  isolated: { mark: '▣', chip: 'bg-hold-light border-hold/50', fill: '#fef3c7', stroke: '#92400e', meaning: 'Locked out and verified; work may start.' },
  'in-work': { mark: '◆', chip: 'bg-hold-light border-hold', fill: '#fde68a', stroke: '#92400e', meaning: 'Fitters are making joints.' },
  curing: { mark: '◔', chip: 'bg-hold-light border-hold/70 border-dotted', fill: '#fef3c7', stroke: '#92400e', meaning: 'Joints made; set and cure holds run.' },
  testing: { mark: '◑', chip: 'bg-tide-light border-tide border-dotted', fill: '#99f6e4', stroke: '#0b655e', meaning: 'Cure over; pressure test under way.' },
  ready: { mark: '●', chip: 'bg-tide-light border-tide', fill: '#5eead4', stroke: '#0a4d47', meaning: 'Test passed, locks off; waiting for operations.' },
  released: { mark: '✓', chip: 'bg-paper-raised border-tide', fill: '#ffffff', stroke: '#0b655e', meaning: 'Back in service.' },
  closed: { mark: '■', chip: 'bg-paper-raised border-ink/30', fill: '#ffffff', stroke: '#3d4a57', meaning: 'Record complete.' },
  cancelled: { mark: '×', chip: 'bg-refuse-light border-refuse/50', fill: '#fee4e2', stroke: '#a61f15', meaning: 'Called off, with a reason.' },
};
