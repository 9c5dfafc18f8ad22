import { ledgerSettingsKey, type LedgerSettings } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { lastPunchRow, punchesAddedAfter } from '../punches/added-punches.js';

/** The clocked seconds of a line, per technician and in all. */
export interface LineSeconds {
  total: number;
  byTechnician: Map<number, number>;
}

/** A technician's punches from a shift-out to the next, around their punches on lines (instants in ms). */
export interface PunchWindow {
  technicianId: number;
  start: number;
  end: number;
}

interface KeptLine {
  seconds: LineSeconds;
  windows: PunchWindow[];
  /** The `now` it was counted at: an earlier `now` counts afresh. */
  countedAt: number;
}

/** Lines kept; beyond, the longest kept go first. */
const KEPT_LINES = 10_000;

/**
 * Clocked seconds of lines whose every window of punches ended with a shift-out, kept until a punch
 * could change them: one on the line, or one that falls in (or corrects one in) a window of the same
 * technician. Punches are only ever added, so the rows past the highest rowid seen are the new ones;
 * rows timed after the last look (a kiosk's clock a little ahead) are looked at again.
 */
export class KeptLineSeconds {
  private readonly lines = new Map<number, KeptLine>();
  private readonly byTechnician = new Map<number, Set<number>>();
  private seen: { row: number; at: number } | null = null;
  private keptFor = '';

  constructor(private readonly db: Db) {}

  /** Forgets the lines that punches added since the last look (or changed ledger settings) may change. */
  refresh(settings: LedgerSettings, now: Date): void {
    const key = ledgerSettingsKey(settings);
    const seen = this.seen;
    if (seen === null || key !== this.keptFor) {
      this.lines.clear();
      this.byTechnician.clear();
      this.keptFor = key;
      this.seen = { row: lastPunchRow(this.db), at: now.getTime() };
      return;
    }
    const added = punchesAddedAfter(this.db, seen.row, seen.at);
    const row = added.reduce((last, punch) => Math.max(last, punch.row), seen.row);
    this.seen = { row, at: now.getTime() };
    for (const punch of added) {
      this.forget(punch.jobLineId);
      this.forget(punch.correctedLineId);
      this.forgetAround(punch.technicianId, punch.at);
      if (punch.correctedTechnicianId !== null)
        this.forgetAround(punch.correctedTechnicianId, punch.correctedAt!);
    }
  }

  get(lineId: number, now: Date): LineSeconds | undefined {
    const kept = this.lines.get(lineId);
    return kept && kept.countedAt <= now.getTime() ? kept.seconds : undefined;
  }

  keep(lineId: number, seconds: LineSeconds, windows: PunchWindow[], now: Date): void {
    this.forget(lineId);
    if (this.lines.size >= KEPT_LINES) this.forget(this.lines.keys().next().value!);
    this.lines.set(lineId, { seconds, windows, countedAt: now.getTime() });
    for (const { technicianId } of windows) {
      const own = this.byTechnician.get(technicianId);
      if (own) own.add(lineId);
      else this.byTechnician.set(technicianId, new Set([lineId]));
    }
  }

  private forget(lineId: number | null): void {
    const kept = lineId === null ? undefined : this.lines.get(lineId);
    if (!kept) return;
    this.lines.delete(lineId!);
    for (const { technicianId } of kept.windows) this.byTechnician.get(technicianId)?.delete(lineId!);
  }

  /** Forgets the technician's lines with a window that holds the instant. */
  private forgetAround(technicianId: number, at: number): void {
    for (const lineId of this.byTechnician.get(technicianId) ?? [])
      if (
        this.lines
          .get(lineId)
          ?.windows.some((w) => w.technicianId === technicianId && w.start <= at && at <= w.end)
      )
        this.forget(lineId);
  }
}
