#!/usr/bin/env bash
# Renders the instrument samples that abcjs's synth loads from public/soundfonts/ (STACK.md
# gotcha 5), so playback never reaches beyond the app. Run by hand; the mp3 files are committed.
#
#   apt-get install fluid-soundfont-gm fluidsynth lame sox
#   bash scripts/make-soundfont.sh
#
# Layout abcjs requests (node_modules/abcjs/src/synth/load-note.js and pitch-to-note-name.js):
#   <soundFontUrl><instrument>-mp3/<Note><octave>.mp3, flats spelt "Db Eb Gb Ab Bb".
# Instruments: "violin" (GM program 40) for the melody, "percussion" (abcjs's name for the GM
# drum kit, its program 128) for the count-in clicks, which the player plays on notes 76 and 77
# (woodblocks, GM percussion key map).
set -euo pipefail

ROOT="$(cd "$(dirname "$0")/.." && pwd)"
SF2="${SF2:-/usr/share/sounds/sf2/FluidR3_GM.sf2}"
OUT="$ROOT/public/soundfonts"
LOW="${LOW:-48}"   # C3: below the fiddle's G3, for tunes written an octave low
HIGH="${HIGH:-96}" # C7: above the fiddle's usual top
for tool in fluidsynth lame sox node; do
  command -v "$tool" >/dev/null || { echo "missing $tool (apt-get install fluidsynth lame sox)" >&2; exit 1; }
done
[ -f "$SF2" ] || { echo "missing $SF2 (apt-get install fluid-soundfont-gm)" >&2; exit 1; }

WORK="$(mktemp -d)"
trap 'rm -rf "$WORK"' EXIT

# One short MIDI file per note: format 0, 480 ticks per quarter at the default 120 bpm
# (so 960 ticks = 1 s). Written by node because fluidsynth only renders offline from a file.
midi() { # midi <file> <channel 0-15> <program or -1> <key> <ticks held>
  node -e '
    const [file, ch, prog, key, held] = process.argv.slice(1).map((v, i) => (i ? Number(v) : v));
    const vlq = (n) => { const b = [n & 0x7f]; while ((n >>= 7)) b.unshift((n & 0x7f) | 0x80); return b; };
    const ev = [];
    if (prog >= 0) ev.push(0, 0xc0 | ch, prog);
    ev.push(0, 0x90 | ch, key, 100, ...vlq(held), 0x80 | ch, key, 0, ...vlq(960), 0xff, 0x2f, 0);
    const len = [24, 16, 8, 0].map((s) => (ev.length >> s) & 0xff);
    const head = [0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 0, 0, 1, 0x01, 0xe0];
    require("fs").writeFileSync(file, Buffer.from([...head, 0x4d, 0x54, 0x72, 0x6b, ...len, ...ev]));
  ' "$@"
}

NAMES=(C Db D Eb E F Gb G Ab A Bb B)
note_name() { echo "${NAMES[$(($1 % 12))]}$(($1 / 12 - 1))"; }

# render <instrument dir> <channel> <program> <key> <held ticks> <seconds kept> <fade seconds>
render() {
  local dir="$OUT/$1-mp3" name
  name="$(note_name "$4")"
  mkdir -p "$dir"
  midi "$WORK/n.mid" "$2" "$3" "$4" "$5"
  fluidsynth -ni -q -g 0.6 -r 44100 -F "$WORK/n.wav" "$SF2" "$WORK/n.mid" >/dev/null 2>&1
  # Mono, level each note alike (headroom for overlapping notes), keep a short note with a fade:
  # abcjs cuts and fades each note to its written length itself (src/synth/place-note.js).
  sox "$WORK/n.wav" -c 1 "$WORK/m.wav" trim 0 "$6" fade t 0.005 "$6" "$7" gain -n -4
  lame --quiet -m m -b 40 --resample 22.05 "$WORK/m.wav" "$dir/$name.mp3"
}

rm -rf "$OUT/violin-mp3" "$OUT/percussion-mp3"
for key in $(seq "$LOW" "$HIGH"); do
  # Held 2.5 s (2400 ticks) and kept 2.6 s: long enough for a half note at the slowest tempo of a reel.
  render violin 0 40 "$key" 2400 2.6 0.35
done
for key in 76 77; do
  render percussion 9 -1 "$key" 240 0.4 0.15
done

cp /usr/share/doc/fluid-soundfont-gm/copyright "$OUT/LICENSE-FluidR3_GM.txt"
echo "wrote $(find "$OUT" -name '*.mp3' | wc -l) files, $(du -sh "$OUT" | cut -f1) in $OUT"
