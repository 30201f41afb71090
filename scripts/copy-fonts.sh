#!/usr/bin/env bash
# Copies the shipped font files out of their npm packages into fonts/ (run once by a developer; fonts/ is committed).
set -euo pipefail
cd "$(dirname "$0")/.."
mkdir -p fonts
for w in 400Regular 600SemiBold 700Bold; do
  cp "node_modules/@expo-google-fonts/inter/$w/Inter_$w.ttf" fonts/
done
cp node_modules/@fontsource/inter/LICENSE fonts/LICENSE-Inter-OFL.txt
for f in DejaVuSans DejaVuSans-Bold DejaVuSansCondensed DejaVuSansCondensed-Bold DejaVuSansMono DejaVuSansMono-Bold; do
  cp "node_modules/dejavu-fonts-ttf/ttf/$f.ttf" fonts/
done
cp node_modules/dejavu-fonts-ttf/LICENSE fonts/LICENSE-DejaVu.txt
ls -la fonts
