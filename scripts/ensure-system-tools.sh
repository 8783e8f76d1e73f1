#!/usr/bin/env bash
# Makes sure the Debian tools the tests call are present: installs them when run as root,
# otherwise stops at once with the exact install command. Nothing is skipped silently.
set -uo pipefail

missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium)
command -v pdfsig >/dev/null 2>&1 && command -v pdftotext >/dev/null 2>&1 && command -v pdftoppm >/dev/null 2>&1 || missing+=(poppler-utils)
command -v qpdf >/dev/null 2>&1 || missing+=(qpdf)
command -v openssl >/dev/null 2>&1 || missing+=(openssl)
if ! command -v Rscript >/dev/null 2>&1 || ! Rscript -e 'quit(status = !requireNamespace("segmented", quietly = TRUE))' >/dev/null 2>&1; then
  missing+=(r-cran-segmented)
fi
fc-list 2>/dev/null | grep -qi dejavu || missing+=(fonts-dejavu-core)

[ ${#missing[@]} -eq 0 ] && exit 0

if [ "$(id -u)" = "0" ]; then
  echo "Installing Debian packages the tests need: ${missing[*]}" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >&2 && apt-get install -y -qq --no-install-recommends "${missing[@]}" >&2 || {
    echo "apt-get install failed for: ${missing[*]}" >&2
    exit 1
  }
else
  echo "The tests need Debian packages that are missing. Install them with:" >&2
  echo "  sudo apt-get update && sudo apt-get install -y ${missing[*]}" >&2
  exit 1
fi
