// A short buzz and an optional soft click, so a tap can be felt and heard without looking.

let audio: AudioContext | null = null;

export function buzz(kind: 'step' | 'round' | 'note' | 'undo') {
  if (typeof navigator === 'undefined' || typeof navigator.vibrate !== 'function') return;
  const pattern =
    kind === 'round' ? [25, 60, 25] : kind === 'note' ? [60, 80, 60] : kind === 'undo' ? [8, 40, 8] : 12;
  try {
    navigator.vibrate(pattern);
  } catch {
    /* some browsers refuse vibration outside a gesture */
  }
}

export function click(kind: 'step' | 'round' | 'undo') {
  try {
    const Ctx =
      window.AudioContext ??
      (window as unknown as { webkitAudioContext?: typeof AudioContext }).webkitAudioContext;
    if (!Ctx) return;
    audio ??= new Ctx();
    if (audio.state === 'suspended') void audio.resume();
    const t = audio.currentTime;
    const osc = audio.createOscillator();
    const gain = audio.createGain();
    osc.frequency.value = kind === 'round' ? 660 : kind === 'undo' ? 330 : 880;
    gain.gain.setValueAtTime(0.0001, t);
    gain.gain.exponentialRampToValueAtTime(0.15, t + 0.005);
    gain.gain.exponentialRampToValueAtTime(0.0001, t + (kind === 'round' ? 0.12 : 0.04));
    osc.connect(gain).connect(audio.destination);
    osc.start(t);
    osc.stop(t + 0.15);
  } catch {
    /* sound is optional */
  }
}
