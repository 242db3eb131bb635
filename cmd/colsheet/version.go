package main

import (
	"crypto/sha256"
	"encoding/hex"
	"io"
	"os"
	"runtime/debug"
	"strings"
	"sync"
)

// version returns the version of the running build, read once from its build info.
var version = sync.OnceValue(func() string {
	info, ok := debug.ReadBuildInfo()
	if !ok {
		return "devel"
	}
	return versionOf(info)
})

// versionOf names a build by its module version and VCS revision: the module version when the
// build recorded one (a pseudo-version already names the revision), else "devel-" and the first
// 12 digits of the revision, with "+dirty" for a modified tree; "devel" when neither was recorded
// (a build with VCS stamping off, or a test binary).
func versionOf(info *debug.BuildInfo) string {
	mod := info.Main.Version
	if mod == "(devel)" {
		mod = ""
	}
	rev, dirty := "", false
	for _, s := range info.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			dirty = s.Value == "true"
		}
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	v := mod
	switch {
	case mod == "" && rev == "":
		return "devel"
	case mod == "":
		v = "devel-" + rev
	case rev != "" && !strings.Contains(mod, rev):
		v = mod + "-" + rev
	}
	if dirty && !strings.HasSuffix(v, "+dirty") {
		v += "+dirty"
	}
	return v
}

// executableSum returns the SHA-256 of the running executable in lower-case hex.
func executableSum() (string, error) {
	name, err := os.Executable()
	if err != nil {
		return "", err
	}
	f, err := os.Open(name)
	if err != nil {
		return "", err
	}
	defer f.Close()
	h := sha256.New()
	if _, err := io.Copy(h, f); err != nil {
		return "", err
	}
	return hex.EncodeToString(h.Sum(nil)), nil
}
