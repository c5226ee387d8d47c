#!/bin/sh
# Makes fixtures/audio/sox-line.wav (12 kHz, 16-bit) and sox-line.json with SoX (Debian's sox
# 14.4), a synthesizer other than our own: sawtooth and square tones with faded attacks and
# releases, detached by short rests, over a pink-noise floor. Run from anywhere:
#   sh scripts/make-sox-fixture.sh
set -eu
cd "$(dirname "$0")/.."
out=fixtures/audio
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

# midi, wave, length (s), rest after (s)
cat > "$tmp/notes" <<'NOTES'
55 sawtooth 0.30 0.10
59 sawtooth 0.30 0.10
62 square 0.30 0.10
66 sawtooth 0.25 0.06
69 square 0.25 0.06
73 sawtooth 0.40 0.15
50 sawtooth 0.35 0.10
57 square 0.30 0.25
NOTES
lead=0.25

# -R repeatable noise and -D no dither on every step, so the file only changes when the notes do.
sox -R -D -n -r 48000 -b 16 -c 1 "$tmp/000.wav" trim 0 "$lead"
i=0
while read -r midi wave len rest; do
  i=$((i + 1))
  # In sox's synth, %n is n semitones from A4 (MIDI 69).
  sox -R -D -n -r 48000 -b 16 -c 1 "$tmp/$(printf %03d "$i").wav" \
    synth "$len" "$wave" "%$((midi - 69))" fade q 0.02 "$len" 0.03 vol 0.2 pad 0 "$rest"
done < "$tmp/notes"
sox -R -D "$tmp"/0*.wav "$tmp/line.wav"
length=$(soxi -D "$tmp/line.wav")
sox -R -D -n -r 48000 -b 16 -c 1 "$tmp/noise.wav" synth "$length" pinknoise vol 0.002
sox -R -D -m "$tmp/line.wav" "$tmp/noise.wav" -r 12000 -b 16 "$out/sox-line.wav"

awk -v lead="$lead" 'BEGIN {
  t = lead * 1000
  printf "{\n  \"description\": \"Made by scripts/make-sox-fixture.sh with SoX: sawtooth and square tones, detached, over pink noise\",\n  \"sampleRate\": 12000,\n  \"notes\": [\n"
}
{
  if (NR > 1) printf ",\n"
  printf "    { \"midi\": %d, \"timeMs\": %d, \"durationMs\": %d }", $1, t, $3 * 1000
  t += ($3 + $4) * 1000
}
END { printf "\n  ]\n}\n" }' "$tmp/notes" > "$out/sox-line.json"
echo "wrote $out/sox-line.wav and $out/sox-line.json"
