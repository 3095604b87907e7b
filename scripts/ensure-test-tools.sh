#!/usr/bin/env bash
# Installs the system programs the tests drive, when they are missing: Debian's Chromium (browser
# tests through playwright-core) and poppler-utils (pdftotext, pdftoppm read the PDF sheets).
# Fails loudly rather than letting the tests skip.
set -euo pipefail
need=()
command -v chromium >/dev/null 2>&1 || need+=(chromium)
command -v pdftotext >/dev/null 2>&1 || need+=(poppler-utils)
command -v pdftoppm >/dev/null 2>&1 || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  echo "installing test tools: ${need[*]}"
  if [ "$(id -u)" -ne 0 ]; then SUDO=sudo; else SUDO=; fi
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${need[@]}" >/dev/null
fi
command -v chromium >/dev/null && command -v pdftotext >/dev/null && command -v pdftoppm >/dev/null || {
  echo "could not install chromium and poppler-utils; the browser and sheet tests need them" >&2
  exit 1
}
