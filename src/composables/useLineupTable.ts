import { computed, h, ref, type Ref } from 'vue';
import type { DataTableColumns } from 'naive-ui';
import type { Lineup } from '../../shared/schemas/lineup';
import type { SkyOutlook } from '../../shared/schemas/outlook';
import LineupScoreBar from '@/components/lineup/LineupScoreBar.vue';
import OutlookBadge from '@/components/outlook/OutlookBadge.vue';
import TideStatusTag from '@/components/tide/TideStatusTag.vue';
import { clockOf, durationText, nightLabel, nightOf, zoneOf } from './useLineupTime';

/** A row of the results table: a lineup with its night. */
export interface LineupRow extends Lineup {
  /** Local date of the night's evening, 'YYYY-MM-DD'. */
  night: string;
}

const TIDE_ORDER: Record<string, number> = { reachable: 0, unknown: 1, 'cut-off': 2 };

/** Sort key of a sky outlook: mean cloud for a forecast, then the rest after every forecast. */
function outlookOrder(o: SkyOutlook | null): number {
  if (o?.status === 'forecast') return o.meanCloudPct;
  return o?.status === 'no-forecast-yet' ? 1000 : 2000;
}

/**
 * Columns, rows and the cut-off filter of the lineup results table. With `outlookOf`, a "Sky"
 * column shows each lineup's sky outlook badge (the numbers on hover).
 */
export function useLineupTable(
  lineups: Ref<readonly Lineup[]>,
  timeZone: Ref<string>,
  onOpen: (row: LineupRow) => void,
  outlookOf?: (row: LineupRow) => SkyOutlook | null,
) {
  const hideCutOff = ref(false);

  const allRows = computed<LineupRow[]>(() => lineups.value.map((l) => ({ ...l, night: nightOf(l.start, timeZone.value) })));
  const rows = computed(() => (hideCutOff.value ? allRows.value.filter((r) => r.tideStatus !== 'cut-off') : allRows.value));
  const hasTideStatus = computed(() => allRows.value.some((r) => r.tideStatus !== undefined));
  const cutOffCount = computed(() => allRows.value.filter((r) => r.tideStatus === 'cut-off').length);

  const columns = computed<DataTableColumns<LineupRow>>(() => {
    const tz = timeZone.value;
    return [
      {
        title: 'Night of', key: 'night', minWidth: 130, defaultSortOrder: 'ascend',
        sorter: (a, b) => a.start.localeCompare(b.start),
        render: (row) => h('span', { class: 'night' }, nightLabel(row.night)),
      },
      {
        title: 'Start – end', key: 'start', minWidth: 150,
        render: (row) => h('span', { class: 'mono' }, `${clockOf(row.start, tz)} – ${clockOf(row.end, tz)} ${zoneOf(row.start, tz)}`),
      },
      { title: 'Peak', key: 'peak', width: 100, render: (row) => h('span', { class: 'mono' }, `${clockOf(row.peak, tz)} ${zoneOf(row.peak, tz)}`) },
      {
        title: 'Duration', key: 'durationMin', width: 110,
        sorter: (a, b) => a.durationMin - b.durationMin,
        render: (row) => h('span', { class: 'mono' }, durationText(row.durationMin)),
      },
      {
        title: 'Target at peak', key: 'peakAltitudeDeg', minWidth: 150,
        sorter: (a, b) => a.peakAltitudeDeg - b.peakAltitudeDeg,
        render: (row) => h('span', { class: 'mono' }, `alt ${row.peakAltitudeDeg.toFixed(1)}° · az ${row.peakAzimuthDeg.toFixed(1)}°`),
      },
      {
        title: 'Moon', key: 'moonIllumination', minWidth: 130,
        sorter: (a, b) => a.moonIllumination - b.moonIllumination,
        render: (row) => h('span', { class: 'mono' }, `${row.moonAltitudeDeg < 0 ? 'down' : `up ${row.moonAltitudeDeg.toFixed(0)}°`} · ${Math.round(row.moonIllumination * 100)} % lit`),
      },
      {
        title: 'Score', key: 'score', minWidth: 140,
        sorter: (a, b) => a.score - b.score,
        render: (row) => h(LineupScoreBar, { score: row.score }),
      },
      ...(outlookOf ? [{
        title: 'Sky', key: 'outlook', minWidth: 130,
        sorter: (a: LineupRow, b: LineupRow) => outlookOrder(outlookOf(a)) - outlookOrder(outlookOf(b)),
        render: (row: LineupRow) => h(OutlookBadge, { outlook: outlookOf(row), timeZone: tz }),
      }] : []),
      {
        title: 'Tide', key: 'tideStatus', minWidth: 150,
        sorter: (a, b) => (TIDE_ORDER[a.tideStatus ?? ''] ?? 3) - (TIDE_ORDER[b.tideStatus ?? ''] ?? 3),
        render: (row) => h(TideStatusTag, { status: row.tideStatus, cutOffAt: row.tideCutOffAt ?? null, timeZone: tz }),
      },
    ];
  });

  function rowProps(row: LineupRow) {
    return {
      class: 'lineup-row',
      style: 'cursor: pointer',
      'data-testid': 'lineup-row',
      'data-night': row.night,
      title: 'Open the night chart',
      onClick: () => onOpen(row),
    };
  }

  return { hideCutOff, rows, allRows, columns, rowProps, hasTideStatus, cutOffCount };
}
