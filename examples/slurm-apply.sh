#!/usr/bin/env bash
# Label a whole cohort with a Gleaner study on a Slurm cluster: one array task per partition file.
#
#   find DATASET -type f -name '*.parquet' | sort > parts.txt      # one partition file per line
#   sbatch --array=0-$(( $(wc -l < parts.txt) - 1 )) examples/slurm-apply.sh STUDY parts.txt OUT
#
# Task i runs `gleaner apply STUDY <line i+1 of parts.txt> --out OUT/parts/<i, six digits>`, so the
# tasks share nothing: each writes its partition's labels and its own manifest.json (input and study
# SHA-256s, row counts, the cautions). Partitions must hold whole subjects when the study's recipe
# has per-subject steps (docs/apply.md). GLEANER says how to run Gleaner (default "gleaner"); the
# study's own windows table must be readable from the nodes at the path saved in the study (or pass
# --study-input through GLEANER_APPLY_FLAGS).
#SBATCH --job-name=gleaner-apply
#SBATCH --cpus-per-task=1
#SBATCH --mem=4G
#SBATCH --time=01:00:00
#SBATCH --output=gleaner-apply-%A_%a.log
set -euo pipefail

if [ "$#" -ne 3 ]; then
  echo "usage: sbatch --array=0-<parts - 1> $0 STUDY PARTS_LIST OUT" >&2
  exit 2
fi
study=$1 list=$2 out=$3
task=${SLURM_ARRAY_TASK_ID:?"run this with sbatch --array (SLURM_ARRAY_TASK_ID is not set)"}
part=$(sed -n "$((task + 1))p" "$list")
if [ -z "$part" ]; then
  echo "slurm-apply: $list has no line $((task + 1)) for array task $task" >&2
  exit 1
fi
read -r -a gleaner <<< "${GLEANER:-gleaner}"
read -r -a extra <<< "${GLEANER_APPLY_FLAGS:-}"
dest="$out/parts/$(printf '%06d' "$task")"
mkdir -p "$dest"
"${gleaner[@]}" apply "$study" "$part" --out "$dest" --progress lines "${extra[@]}"
