import { ref, watch } from 'vue';

// One AudioContext for the page: browsers limit how many a page may open, and it must be
// resumed from a tap before it may sound (autoplay rules).
let context: AudioContext | null = null;

type AudioWindow = Window & { webkitAudioContext?: typeof AudioContext };

function audio(): AudioContext | null {
  if (context) return context;
  const Ctor = window.AudioContext ?? (window as AudioWindow).webkitAudioContext;
  if (!Ctor) return null;
  try {
    context = new Ctor();
  } catch {
    return null;
  }
  return context;
}

const SOUND_KEY = 'rindwise:vat:sound';

function storedSound(): boolean {
  try {
    return localStorage.getItem(SOUND_KEY) !== 'off';
  } catch {
    return true;
  }
}

/**
 * Beeps (a tone made with the Web Audio API, no sound file) and buzzes (navigator.vibrate)
 * for a prompt or a timer that has run out. `unlock()` must run from a tap so the browser
 * lets the page sound later (`ready` says whether it has); the maker can turn the sound off.
 */
export function useVatAlert() {
  const soundOn = ref(storedSound());
  /** The browser lets the page sound: a tap has resumed the audio since the page loaded. */
  const ready = ref(context?.state === 'running');
  watch(soundOn, (on) => {
    try {
      localStorage.setItem(SOUND_KEY, on ? 'on' : 'off');
    } catch {
      // Not remembered; the toggle still works on this page.
    }
  });

  function unlock() {
    const a = audio();
    if (!a) return;
    if (a.state === 'running') {
      ready.value = true;
      return;
    }
    void a
      .resume()
      .then(() => (ready.value = a.state === 'running'))
      .catch(() => undefined);
  }

  /** Plays short tones at the given offsets, seconds, at `hz`. */
  function beep(offsets: number[] = [0, 0.3, 0.6], hz = 880) {
    if (!soundOn.value) return;
    const a = audio();
    if (!a) return;
    if (a.state === 'suspended') void a.resume().catch(() => undefined);
    const t0 = a.currentTime + 0.02;
    for (const offset of offsets) {
      const osc = a.createOscillator();
      const gain = a.createGain();
      osc.type = 'square';
      osc.frequency.value = hz;
      // A quick rise and fall, so the tone does not click.
      gain.gain.setValueAtTime(0.0001, t0 + offset);
      gain.gain.exponentialRampToValueAtTime(0.35, t0 + offset + 0.02);
      gain.gain.exponentialRampToValueAtTime(0.0001, t0 + offset + 0.2);
      osc.connect(gain).connect(a.destination);
      osc.start(t0 + offset);
      osc.stop(t0 + offset + 0.22);
    }
  }

  function vibrate(pattern: number[]) {
    try {
      navigator.vibrate?.(pattern);
    } catch {
      // Not on this device.
    }
  }

  /** A repeating prompt is due: three short beeps and buzzes. */
  function promptDue() {
    beep([0, 0.3, 0.6], 880);
    vibrate([200, 100, 200, 100, 200]);
  }

  /** A step or press stage reached its time: a longer, lower call. */
  function timeUp() {
    beep([0, 0.25, 0.5, 0.9, 1.15, 1.4], 660);
    vibrate([500, 200, 500]);
  }

  return { soundOn, ready, unlock, beep, promptDue, timeUp };
}
