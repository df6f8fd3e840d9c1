// The words of the refused-scans page, in English. zh-CN.ts has the same keys.
export const en = {
  page: {
    title: 'Refused scans',
    subtitle: 'Scans the server refused, kept so none is lost. Try one again once its cause is gone, or close it with what was done.',
    show: 'Show',
    open: 'Open',
    resolved: 'Resolved',
    all: 'All',
  },
  row: {
    scan: 'Scan',
    heading: '{{what}} at {{station}}',
    unknownStation: 'unknown station',
    unknownOperator: 'unknown operator',
    times: '{{operator}} · scanned {{scanned}} · received {{received}}',
    told: 'What the operator was told to do: ',
    resolved: 'Resolved',
    acceptedLate: 'accepted when the missing scans arrived',
    acceptedOnRetry: 'accepted on retry',
    retry: 'Try again now',
    whatWasDone: 'What was done',
    notePlaceholder: 'What was done (e.g. scanned again at the right station)',
    resolve: 'Resolve',
    stillRefused: 'Still refused: {{message}}',
    acceptedNow: 'Accepted now.',
    notDone: 'Not done',
  },
  empty: {
    title: 'No refused scans',
    text: 'Every scan the tablets sent was accepted.',
  },
};

type Strings<T> = { [K in keyof T]: T[K] extends string ? string : Strings<T[K]> };
export type ScanExceptionsStrings = Strings<typeof en>;
