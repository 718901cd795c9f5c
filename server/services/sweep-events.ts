import type { MikroORM } from '@mikro-orm/postgresql';
import type { SweepEvent, SweepSummary } from '../../shared/api';
import { finished, sweepPointRows, sweepPointStates, sweepSummary } from './sweep-rows';

interface Listener {
  send: (event: SweepEvent) => void;
  end: () => void;
}

interface Watch {
  listeners: Set<Listener>;
  states: Map<number, string>;
  summary: string;
  timer: ReturnType<typeof setInterval>;
  busy: boolean;
}

/**
 * Progress of sweeps for the event streams. Workers only write rows (from any machine), so this looks: one poll
 * per watched sweep every `intervalMs`, however many people watch it, reading a fingerprint of the points and
 * then only the points that changed. Stops looking when the last listener leaves or the sweep finishes.
 */
export class SweepEvents {
  private readonly watches = new Map<number, Watch>();

  constructor(
    private readonly orm: MikroORM,
    private readonly intervalMs = 400,
  ) {}

  /** Sends the sweep as it is now, then its changes until it finishes (then `end`); answers an unsubscribe. */
  async subscribe(id: number, send: Listener['send'], end: Listener['end']): Promise<() => void> {
    const em = this.orm.em.fork();
    const [summary, states] = await Promise.all([sweepSummary(em, id), sweepPointStates(em, id)]);
    if (!summary) {
      end();
      return () => undefined;
    }
    send({ type: 'snapshot', sweep: { ...summary, points: await sweepPointRows(em, id) } });
    if (finished(summary.status)) {
      end();
      return () => undefined;
    }
    const listener: Listener = { send, end };
    let watch = this.watches.get(id);
    if (!watch) {
      watch = { listeners: new Set(), states, summary: key(summary), busy: false, timer: setInterval(() => void this.poll(id), this.intervalMs) };
      this.watches.set(id, watch);
    }
    watch.listeners.add(listener);
    return () => {
      const w = this.watches.get(id);
      if (!w) return;
      w.listeners.delete(listener);
      if (w.listeners.size === 0) this.drop(id);
    };
  }

  private async poll(id: number): Promise<void> {
    const watch = this.watches.get(id);
    if (!watch || watch.busy) return;
    watch.busy = true;
    try {
      const em = this.orm.em.fork();
      const [summary, states] = await Promise.all([sweepSummary(em, id), sweepPointStates(em, id)]);
      if (!summary) return this.finish(id);
      const changed = [...states].filter(([index, state]) => watch.states.get(index) !== state).map(([index]) => index);
      watch.states = states;
      if (changed.length > 0) {
        for (const point of await sweepPointRows(em, id, changed)) this.emit(watch, { type: 'point', point });
      }
      if (key(summary) !== watch.summary) {
        watch.summary = key(summary);
        this.emit(watch, { type: 'status', sweep: summary });
      }
      if (finished(summary.status)) this.finish(id);
    } catch (err) {
      console.error(`[sweeps] progress of sweep ${id}: ${err instanceof Error ? err.message : String(err)}`);
    } finally {
      watch.busy = false;
    }
  }

  private emit(watch: Watch, event: SweepEvent): void {
    for (const l of watch.listeners) l.send(event);
  }

  private finish(id: number): void {
    const watch = this.watches.get(id);
    if (!watch) return;
    this.drop(id);
    for (const l of watch.listeners) l.end();
  }

  private drop(id: number): void {
    const watch = this.watches.get(id);
    if (watch) clearInterval(watch.timer);
    this.watches.delete(id);
  }

  /** Ends every stream (at shutdown). */
  close(): void {
    for (const id of [...this.watches.keys()]) this.finish(id);
  }
}

function key(s: SweepSummary): string {
  return `${s.status}/${s.done}/${s.failed}/${s.message ?? ''}`;
}
