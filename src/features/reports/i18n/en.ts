// The words of the report screens that say which unit a figure is in, in English. zh-CN.ts has the same keys.
export const en = {
  cycleTime: {
    loading: 'Working out cycle times…',
    note: 'Queue time runs from the previous step’s finish (or the end of a cure, or release) to the start; process time from start to finish. Each time is shown in clock minutes (nights and days off included) and in working minutes (only the station’s shifts count).',
    flowTitle: 'Flow efficiency',
    noTray: 'No tray finished in this period.',
    noTrayStation: 'No tray finished in this period (not shown for a single station).',
    headline: 'of working time was spent on the trays’ process steps: {{process}} of process in {{flow}} of flow time, both in working hours, summed over the {{trays}} trays finished.',
    calendar: 'Counted on the clock instead (process and flow both in clock hours: {{process}} in {{flow}}): {{share}}.',
    cure: 'Oven cure is needed but unattended, so it is not counted as value-adding: it took {{working}} of the working time and {{calendar}} of the clock time, shown apart.',
    chartTitle: 'Queue and process time per kind of station (working minutes, p50)',
    chartCaption: 'Working minutes: only the station’s shifts count. The table gives clock minutes beside them; the CSV has the full spread (p95 too).',
    axis: 'working minutes',
    queueP50: 'Waiting (p50, working min)',
    processP50: 'Process (p50, working min)',
    table: 'Cycle time table',
    col: {
      kind: 'Kind',
      processN: 'Process n',
      processClock: 'Process {{stat}} (clock min)',
      processWorking: 'Process {{stat}} (working min)',
      queueN: 'Queue n',
      queueClock: 'Queue {{stat}} (clock min)',
      queueWorking: 'Queue {{stat}} (working min)',
    },
    stat: { p50: 'p50', p85: 'p85', mean: 'mean' },
  },
};

export type ReportsStrings = typeof en;
