// How incidents read on screen: kind, severity and status as words, and the hazard level that
// colours a severity (always shown with its word and icon, never colour alone).
import type { HazardLevel } from '@/components/theme/tokens';
import {
  incidentKindWords,
  incidentSeverityWords,
  incidentStatusWords,
  type IncidentKind,
  type IncidentSeverity,
  type IncidentStatus,
} from '@/shared/schemas/incidents';

export const kindLabel = (kind: IncidentKind) => incidentKindWords[kind].label;
export const severityLabel = (severity: IncidentSeverity) => incidentSeverityWords[severity].label;
export const statusLabel = (status: IncidentStatus) => incidentStatusWords[status];

/** Severe and serious carry the danger and warning colours; moderate caution; low information. */
export const severityHazard: Record<IncidentSeverity, HazardLevel> = {
  severe: 'danger',
  serious: 'warning',
  moderate: 'caution',
  low: 'info',
};

/** "Arc-over or flashover, serious — Bay 3" */
export function incidentHeadline(i: { kind: IncidentKind; severity: IncidentSeverity }): string {
  return `${kindLabel(i.kind)}, ${severityLabel(i.severity).toLowerCase()}`;
}
