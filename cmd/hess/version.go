package main

import (
	"fmt"
	"io"
	"runtime/debug"
)

// version, when set at link time (-ldflags "-X main.version=…"), is the
// release version; otherwise the version comes from the build information.
var version = ""

// toolVersion is the version this binary reports: the link-time version,
// else what the Go build recorded (buildVersion).
func toolVersion() string {
	if version != "" {
		return version
	}
	info, _ := debug.ReadBuildInfo()
	return buildVersion(info)
}

// buildVersion reads a version from build information: the main module's
// version when it was built as a module (go install hess@v1.2.0), else the
// version-control revision (its first 12 hex digits, with "+modified" when
// the work tree had uncommitted changes), else "devel".
func buildVersion(info *debug.BuildInfo) string {
	if info == nil {
		return "devel"
	}
	if v := info.Main.Version; v != "" && v != "(devel)" {
		return v
	}
	var rev string
	var modified bool
	for _, s := range info.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			modified = s.Value == "true"
		}
	}
	if rev == "" {
		return "devel"
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	if modified {
		rev += "+modified"
	}
	return rev
}

func modulePath() string {
	if info, ok := debug.ReadBuildInfo(); ok && info.Main.Path != "" {
		return info.Main.Path
	}
	return "hess"
}

func runVersion(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("version", "version", "Print the version and module path. The version is the module version\n"+
		"of a released build, else the revision it was built from, else \"devel\".", stderr)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) > 0 {
		fmt.Fprintln(stderr, "hess version: takes no arguments")
		return exitTrouble
	}
	return writeOut("version", stdout, stderr, fmt.Sprintf("hess %s (module %s)\n", toolVersion(), modulePath()))
}
