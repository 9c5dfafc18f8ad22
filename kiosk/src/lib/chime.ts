/**
 * The timer chime: two soft tones made with Web Audio, no sound files. Browsers keep audio locked
 * until the page gets a tap, so the first tap anywhere unlocks it.
 */
type AudioContextClass = typeof AudioContext;

let context: AudioContext | null = null;
const listeners = new Set<() => void>();

function audioClass(): AudioContextClass | null {
  const scope = globalThis as { AudioContext?: AudioContextClass; webkitAudioContext?: AudioContextClass };
  return scope.AudioContext ?? scope.webkitAudioContext ?? null;
}

function emit() {
  for (const listener of listeners) listener();
}

function unlock() {
  const Ctor = audioClass();
  if (!Ctor) return;
  try {
    context ??= new Ctor();
    if (context.state === 'suspended') void context.resume().then(emit, () => undefined);
    else emit();
  } catch {
    context = null;
  }
}

/** Listens for the first taps and unlocks audio with them; returns a cleanup. */
export function installAudioUnlock(): () => void {
  const events = ['pointerdown', 'keydown', 'touchend'] as const;
  const onGesture = () => {
    unlock();
    if (context?.state === 'running')
      for (const name of events) window.removeEventListener(name, onGesture, { capture: true });
  };
  for (const name of events) window.addEventListener(name, onGesture, { capture: true, passive: true });
  return () => {
    for (const name of events) window.removeEventListener(name, onGesture, { capture: true });
  };
}

/** Whether a chime would be heard now. */
export const audioReady = (): boolean => context?.state === 'running';

export const audioState = {
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
  ready: audioReady,
};

function tone(ctx: AudioContext, frequency: number, start: number, length: number) {
  const osc = ctx.createOscillator();
  const gain = ctx.createGain();
  osc.type = 'sine';
  osc.frequency.setValueAtTime(frequency, start);
  // A quick rise and a long fade: a bell-like tone rather than a beep.
  gain.gain.setValueAtTime(0.0001, start);
  gain.gain.exponentialRampToValueAtTime(0.35, start + 0.02);
  gain.gain.exponentialRampToValueAtTime(0.0001, start + length);
  osc.connect(gain).connect(ctx.destination);
  osc.start(start);
  osc.stop(start + length + 0.05);
}

function schedule(ctx: AudioContext) {
  const t = ctx.currentTime + 0.02;
  tone(ctx, 659.25, t, 0.45);
  tone(ctx, 987.77, t + 0.22, 0.7);
}

/**
 * Plays the two-tone chime. A context the browser suspended since (a tablet that slept) is woken
 * first, which the browser allows once the page has had a tap. False when audio is still locked.
 */
export function playChime(): boolean {
  const ctx = context;
  if (!ctx) return false;
  if (ctx.state === 'running') {
    schedule(ctx);
    return true;
  }
  void ctx.resume().then(
    () => {
      if (ctx.state === 'running') schedule(ctx);
      emit();
    },
    () => undefined,
  );
  return false;
}
