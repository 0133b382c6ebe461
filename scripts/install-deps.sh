#!/usr/bin/env bash
# Installs what brownfloc needs to build and test on Debian 12 (as root). Safe to re-run.
# Package list: ../TOOLCHAIN notes of the project, plus GSL and scipy for reference checks.
set -euo pipefail
packages=(build-essential cmake libeigen3-dev libcereal-dev libsfml-dev catch2 libtomlplusplus-dev
          libcli11-dev librandom123-dev libopenmpi-dev openmpi-bin libbenchmark-dev libfmt-dev
          xvfb xauth libgl1-mesa-dri fonts-dejavu-core python3-numpy python3-scipy libgsl-dev
          clang libclang-rt-14-dev)
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if ((${#missing[@]})); then
  echo "install-deps: installing ${missing[*]}"
  apt-get update
  DEBIAN_FRONTEND=noninteractive apt-get install -y -o DPkg::Lock::Timeout=600 "${missing[@]}"
else
  echo "install-deps: all packages present"
fi
