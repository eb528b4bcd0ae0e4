// Playback through abcjs's own synth (CreateSynth) with fiddle samples rendered from the FluidR3 GM
// soundfont (public/soundfonts, scripts/make-soundfont.sh): nothing is fetched from beyond the app.
import type { MidiBuffer, NoteMapTrack, TuneObject } from "abcjs";
import { loadAbcjs } from "./loaders";
import { countInClicks, practiceBeatsPerMinute, type Click } from "./playback-abc";

export const SOUND_FONT_URL = "/soundfonts/";
const FIDDLE = 40; // General MIDI program 41 "Violin", counted from 0 as abcjs does
// Any valid drum pattern makes abcjs load its percussion samples; the clicks themselves are ours.
const DRUM = "dd 76 77 100 80";
const ACCENT = 76; // GM percussion key map: high woodblock
const BEAT = 77; // low woodblock

export interface PlaySettings {
  tempo: number; // percent of the tune's tempo, 40–120
  countIn: boolean;
  loop: boolean;
  /** Other music (another phrase to loop): go on from its start, count-in included, not from the same bar. */
  fromStart?: boolean;
}

export type PlayerStatus = "idle" | "loading" | "playing" | "paused" | "error";

/** Loudest sample of the built audio (every 16th sample is enough): 0 means no sample loaded. */
function peakOf(buffer: AudioBuffer | undefined): number {
  if (!buffer) return 0;
  const data = buffer.getChannelData(0);
  let peak = 0;
  for (let i = 0; i < data.length; i += 16) peak = Math.max(peak, Math.abs(data[i]));
  return peak;
}

function withClicks(tracks: NoteMapTrack[], clicks: Click[]): NoteMapTrack[] {
  // abcjs's drum intro stays silent before a pickup and its "drum off" comes back on at a repeat,
  // so every percussion note it made is dropped and one bar of clicks is placed by hand.
  for (const track of tracks) {
    for (let i = track.length - 1; i >= 0; i--) if (track[i].instrument === "percussion") track.splice(i, 1);
  }
  if (tracks[0]) {
    for (const c of clicks) {
      tracks[0].push({
        pitch: c.accent ? ACCENT : BEAT,
        instrument: "percussion",
        start: c.start,
        end: c.start + 1 / 16,
        volume: c.accent ? 120 : 90,
        startChar: 0,
        endChar: 0,
      });
    }
  }
  return tracks;
}

// Free meter (M:none) has no fraction: it is timed as 4/4, as abcjs itself does.
function meterOf(tune: TuneObject): { num: number; den: number } {
  const m = tune.getMeterFraction();
  return { num: m.num || 4, den: m.den || 4 };
}

function baseMsPerMeasure(tune: TuneObject): number {
  if (tune.metaText.tempo) return tune.millisecondsPerMeasure();
  return (tune.getBeatsPerMeasure() * 60000) / practiceBeatsPerMinute(meterOf(tune));
}

export class FiddlePlayer {
  private synth: MidiBuffer | null = null;
  private startedAt = 0; // audio-clock time at which the buffer's second 0 would have played
  private pausedAt = 0;
  private countInSec = 0;
  private msPerMeasure = 0;
  private loop = false;
  private ready = false; // the current synth is primed
  private generation = 0; // each load (and dispose) starts a new one; older loads stop at their next step
  private resume: { status: PlayerStatus; bars: number } = { status: "idle", bars: 0 };
  duration = 0;
  peak = 0;
  status: PlayerStatus = "idle";

  constructor(private readonly onChange: (p: FiddlePlayer) => void) {}

  private set(status: PlayerStatus): void {
    this.status = status;
    this.onChange(this);
  }

  private async context(): Promise<AudioContext> {
    return (await loadAbcjs()).synth.activeAudioContext();
  }

  /** Builds the audio for `abc`; playing resumes from the same place in the music if it was playing. */
  async load(abc: string, settings: PlaySettings): Promise<void> {
    const token = ++this.generation;
    try {
      await this.build(abc, settings, token);
    } catch {
      if (token !== this.generation) return;
      this.synth = null;
      this.set("error");
    }
  }

  private async build(abc: string, settings: PlaySettings, token: number): Promise<void> {
    const abcjs = await loadAbcjs();
    if (this.status !== "loading") {
      // Where the music was, in bars, so it can go on from there at any speed. A load that
      // replaces one still in progress keeps what the first one recorded.
      const at =
        this.status === "playing" ? await this.position() : this.status === "paused" ? this.pausedAt : this.countInSec;
      const bars = this.msPerMeasure ? (Math.max(0, at - this.countInSec) * 1000) / this.msPerMeasure : 0;
      this.resume = { status: this.status, bars };
    }
    this.halt();
    this.ready = false;
    this.set("loading");
    const [tune] = abcjs.renderAbc("*", abc);
    const meter = meterOf(tune);
    const meterSize = meter.num / meter.den;
    const pickup = tune.getPickupLength();
    const msPerMeasure = (baseMsPerMeasure(tune) * 100) / settings.tempo;
    const clicks = settings.countIn ? countInClicks(meter, pickup) : [];
    const synth = new abcjs.synth.CreateSynth();
    this.synth = synth;
    await synth.init({
      visualObj: tune,
      millisecondsPerMeasure: msPerMeasure,
      options: {
        soundFontUrl: SOUND_FONT_URL,
        program: FIDDLE,
        chordsOff: true, // the melody only: chord symbols are for an accompanist
        ...(settings.countIn ? { drum: DRUM, drumBars: 1, drumIntro: 1 } : {}),
        sequenceCallback: (tracks) => withClicks(tracks, clicks),
        onEnded: () => {
          if (synth === this.synth) void this.ended();
        },
      },
    });
    const primed = await synth.prime();
    if (token !== this.generation) return; // a newer load took over
    this.peak = peakOf(synth.getAudioBuffer());
    if (this.peak === 0) throw new Error("the fiddle samples did not load");
    this.duration = primed.duration;
    this.msPerMeasure = msPerMeasure;
    this.loop = settings.loop;
    this.countInSec = settings.countIn ? (((meterSize - pickup) / meterSize) * msPerMeasure) / 1000 : 0;
    this.ready = true;
    const { status, bars } = this.resume;
    // Going on after a change skips the new count-in: the student is already playing along.
    const goOn = (status === "playing" || status === "paused") && !settings.fromStart;
    this.pausedAt = goOn ? this.countInSec + (bars * msPerMeasure) / 1000 : 0;
    if (this.pausedAt >= this.duration - 0.3) this.pausedAt = 0;
    if (status === "playing") await this.play();
    else this.set(status === "paused" ? "paused" : "idle");
  }

  async play(): Promise<void> {
    const synth = this.synth;
    if (!synth || !this.ready) {
      // A press of Play while the audio is being (re)built plays it when it is ready, never lost.
      if (this.status === "loading") this.resume = { ...this.resume, status: "playing" };
      return;
    }
    const ctx = await this.context();
    if (ctx.state !== "running") await ctx.resume();
    synth.seek(this.pausedAt, "seconds");
    synth.start();
    this.startedAt = ctx.currentTime - this.pausedAt;
    this.set("playing");
  }

  async pause(): Promise<void> {
    if (this.status !== "playing") return;
    this.pausedAt = await this.position();
    this.synth?.stop();
    this.set("paused");
  }

  /** Back to the start (the count-in plays again). */
  stop(): void {
    this.halt();
    this.pausedAt = 0;
    this.set("idle");
  }

  dispose(): void {
    this.generation++;
    this.halt();
    this.synth = null;
  }

  async audioState(): Promise<AudioContextState> {
    return (await this.context()).state;
  }

  private halt(): void {
    if (this.synth?.getIsRunning()) this.synth.stop();
  }

  private async position(): Promise<number> {
    return (await this.context()).currentTime - this.startedAt;
  }

  private async ended(): Promise<void> {
    const synth = this.synth;
    // abcjs also reports the end of a sound it was asked to stop: only a natural end counts.
    if (!synth || this.status !== "playing" || (await this.position()) < this.duration - 0.5) return;
    synth.stop();
    this.pausedAt = this.loop ? this.countInSec : 0;
    if (this.loop) await this.play();
    else this.set("idle");
  }
}
