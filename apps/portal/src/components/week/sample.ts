/** Invented week boards for component tests (shapes as the API contract gives them). */
import { addDaysIso, WORK_TASKS, type BoardCrew, type CrewDay, type DiffItem, type WeekBoard, type WorkOrderRow } from '@swardwise/domain';

export const WEEK = '2026-11-30';
export const DATES = Array.from({ length: 7 }, (_, i) => addDaysIso(WEEK, i));

let nextId = 1;
export function order(over: Partial<WorkOrderRow> = {}): WorkOrderRow {
  const id = over.id ?? nextId++;
  return {
    id,
    fieldId: 100 + id,
    fieldName: `Pitch ${id}`,
    siteId: 1,
    siteName: 'Alder Green',
    siteAddress: '14 Larch Row',
    fieldStatus: 'open',
    fieldStatusNote: '',
    districtId: 1,
    task: 'mow',
    weekStart: WEEK,
    plannedDate: DATES[0]!,
    crewId: null,
    crewName: null,
    equipmentId: null,
    equipmentName: null,
    plannedHours: 1.5,
    actualHours: null,
    status: 'planned',
    origin: 'generated',
    pinned: false,
    reason: 'The one-third rule asks for a cut by Tuesday',
    notes: '',
    details: { hocMm: 38, mowerKind: 'rotary' },
    doneAt: null,
    version: 1,
    siteLat: 40.01,
    siteLng: -75.02,
    photoCount: 0,
    fieldLat: 41.5,
    fieldLng: -66.5,
    ...over,
  };
}

const CREWS: BoardCrew[] = [
  { id: 11, name: 'North A', hoursPerDay: 8, workDays: ['mon', 'tue', 'wed', 'thu', 'fri'], leadName: 'Ottilie Marsh' },
  { id: 12, name: 'North B', hoursPerDay: 7.5, workDays: ['mon', 'tue', 'wed', 'thu'], leadName: null },
];

export function crewDay(over: Partial<CrewDay> & Pick<CrewDay, 'crewId' | 'date'>): CrewDay {
  const day: CrewDay = {
    availableHours: 8,
    workHours: 0,
    driveKm: 0,
    driveHours: 0,
    loadUnloadHours: 0,
    totalHours: 0,
    overloaded: false,
    route: [],
    orderIds: [],
    ...over,
  };
  day.totalHours = over.totalHours ?? day.workHours + day.driveHours + day.loadUnloadHours;
  day.overloaded = over.overloaded ?? day.totalHours > day.availableHours;
  return day;
}

export function board(orders: WorkOrderRow[], crewDays: CrewDay[] = []): WeekBoard {
  return {
    districtId: 1,
    districtName: 'North',
    weekStart: WEEK,
    dates: DATES,
    yard: { name: 'North yard', lat: 40, lng: -75 },
    crews: CREWS,
    orders,
    crewDays,
    unassignedHours: orders.filter((o) => o.crewId === null).reduce((s, o) => s + o.plannedHours, 0),
    warnings: [],
    lastGeneratedAt: null,
  };
}

/** A large week: `n` orders over the crews, days and ten sites, a tenth of them unassigned. */
export function bigBoard(n: number): WeekBoard {
  const orders: WorkOrderRow[] = [];
  for (let i = 0; i < n; i++) {
    const crew = i % 10 === 0 ? null : CREWS[i % CREWS.length]!;
    orders.push(
      order({
        id: 10_000 + i,
        siteId: 1 + (i % 10),
        siteName: `Site ${1 + (i % 10)}`,
        task: WORK_TASKS[i % WORK_TASKS.length]!,
        plannedDate: DATES[i % 7]!,
        crewId: crew?.id ?? null,
        crewName: crew?.name ?? null,
        plannedHours: 0.5 + (i % 4) * 0.25,
      }),
    );
  }
  return board(orders);
}

export function diffItem(over: Partial<DiffItem> = {}): DiffItem {
  return {
    fieldId: 1,
    fieldName: 'Pitch 1',
    siteName: 'Alder Green',
    task: 'mow',
    plannedDate: DATES[1]!,
    plannedHours: 1.5,
    crewId: 11,
    crewName: 'North A',
    reason: 'The one-third rule asks for a cut by Tuesday',
    ...over,
  };
}
