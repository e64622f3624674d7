# Sum twiggy's "top" rows by crate, and this crate's rows by module.
BEGIN { FS = "┊" }
NR > 2 && NF >= 3 {
  size = $1 + 0; name = $3; sub(/^ +/, "", name)
  if (name ~ /function names|^Σ|^\.\.\. and/) next
  if (name ~ /^data segment|^custom section/) { crate = "(data-and-custom-sections)" }
  else {
    p = name; sub(/^[<&*( ]+/, "", p); sub(/^(mut|dyn) /, "", p)
    if (match(p, /^[A-Za-z_][A-Za-z0-9_]*/)) crate = substr(p, 1, RLENGTH); else crate = "(unnamed)"
    if (crate == "leeward") {
      n = split(p, a, "::"); m = a[1] "::" a[2]
      if (n > 3 && (a[2] == "engine" || a[2] == "ui")) m = m "::" a[3]
      sub(/\[.*/, "", m); mod[m] += size
    }
  }
  by[crate] += size; total += size
}
END {
  for (c in by) printf "  %-44s %9d %5.1f%%\n", c, by[c], 100 * by[c] / total | "sort -k2 -nr | head -20"
  close("sort -k2 -nr | head -20")
  printf "  %-44s %9d\n", "all (raw bytes after wasm-opt)", total
  print "  by module of this crate:"
  for (m in mod) printf "  %-44s %9d\n", m, mod[m] | "sort -k2 -nr | head -24"
}
