#!/usr/bin/env bash
# Copies the IBM Plex Sans files the app serves from @fontsource into public/fonts (run after
# upgrading @fontsource/ibm-plex-sans). The @font-face rules live in app/app.css.
set -euo pipefail
cd "$(dirname "$0")/.."
src=node_modules/@fontsource/ibm-plex-sans/files
for w in 400 500 600 700; do
  cp "$src/ibm-plex-sans-latin-$w-normal.woff2" "$src/ibm-plex-sans-latin-ext-$w-normal.woff2" public/fonts/
done
cp "$src/ibm-plex-sans-latin-400-italic.woff2" public/fonts/
cp node_modules/@fontsource/ibm-plex-sans/LICENSE public/fonts/LICENSE-IBM-Plex-Sans.txt
echo "fonts copied to public/fonts"
