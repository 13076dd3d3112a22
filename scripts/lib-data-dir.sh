# Sourced by the scripts of the local services (pg.sh, mail.sh): the project root and the folder
# their data, logs and pid files go to (CW_DATA_DIR, or .data in the project).
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_ROOT="${CW_DATA_DIR:-$ROOT/.data}"
