/** Help text of the command line. */
import { PROFILE_NAMES, DEFAULT_PROFILE } from '../gate/criteria-profiles.js';

export const USAGE = `usage: loopgate check FILE.json [options]

Judges every loop in FILE.json (the body of POST /v1/checks:
{"criteria": {...}, "loops": [{"name", "plant", "controller"}, ...]}) and
exits 0 when all pass, 1 when any fails, 2 on unusable input, 3 when the
check could not run (server unreachable or failing).

options:
  --profile NAME       criteria profile: ${PROFILE_NAMES.join(', ')} (default ${DEFAULT_PROFILE};
                       replaces the file's criteria.profile, keeps its overrides)
  --format FORMAT      text (default), json (the service's answer) or junit (JUnit XML)
  --output PATH        write the report to PATH; a text table still goes to stdout
  --server URL         ask a running loopgate service instead of checking in-process
  --fail-on-warn       exit 1 when any loop warns
  -h, --help           this text
  -v, --version        the version
`;
