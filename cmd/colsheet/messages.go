package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"syscall"
)

// plainErr returns the reason of a file operation's error without the operation's name ("no
// such file or directory" rather than "open x: no such file or directory"); other errors as they are.
func plainErr(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	var le *os.LinkError
	if errors.As(err, &le) {
		return le.Err
	}
	return err
}

// fileProblem says why the file name, which is what (e.g. "the input file"), cannot be read.
func fileProblem(what, name string, err error) error {
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("%s %s does not exist", what, name)
	case errors.Is(err, fs.ErrPermission):
		return fmt.Errorf("%s %s cannot be read: permission denied", what, name)
	case errors.Is(err, syscall.EISDIR):
		return fmt.Errorf("%s %s is a folder, not a file", what, name)
	}
	return fmt.Errorf("%s %s cannot be read: %v", what, name, plainErr(err))
}

// readFileAs reads the file name, which is what; the error says what the file is and why it
// cannot be read.
func readFileAs(what, name string) ([]byte, error) {
	st, err := os.Stat(name)
	if err == nil && st.IsDir() {
		return nil, fmt.Errorf("%s %s is a folder, not a file", what, name)
	}
	data, err := os.ReadFile(name)
	if err != nil {
		return nil, fileProblem(what, name, err)
	}
	return data, nil
}

// folderProblem checks that dir, which is what (e.g. "the package"), is a folder, and says why not.
func folderProblem(what, dir string) error {
	st, err := os.Stat(dir)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("%s %s does not exist", what, dir)
	case err != nil:
		return fmt.Errorf("%s %s cannot be read: %v", what, dir, plainErr(err))
	case !st.IsDir():
		return fmt.Errorf("%s %s is a file, not a folder", what, dir)
	}
	return nil
}

// outputProblem returns the error err met on the output folder dir as the user reads it: a
// file operation's reason with the folder named, other errors (which name it) as they are.
func outputProblem(dir string, err error) error {
	var pe *fs.PathError
	var le *os.LinkError
	if errors.As(err, &pe) || errors.As(err, &le) {
		return fmt.Errorf("the output folder %s cannot be written: %v", dir, plainErr(err))
	}
	return err
}
