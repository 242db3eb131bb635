package archive

import (
	"bytes"
	"crypto/ed25519"
	"encoding/base64"
	"encoding/hex"
	"fmt"
	"os"
	"strings"
)

// SignatureName is the file, beside the manifest, that holds the manifest's Ed25519 signature.
const SignatureName = "manifest.sig"

// maxKeyFile is the largest key or signature file read: far above any encoding of a key.
const maxKeyFile = 4096

// readKey reads a key file of size bytes (the raw key, or the key in hex or in standard base64,
// surrounding white space ignored).
func readKey(name string, size int) ([]byte, error) {
	st, err := os.Stat(name)
	if err != nil {
		return nil, err
	}
	if !st.Mode().IsRegular() || st.Size() > maxKeyFile {
		return nil, fmt.Errorf("%s: not a key file (a regular file of at most %d bytes)", name, maxKeyFile)
	}
	data, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	return decodeKey(name, data, size)
}

// decodeKey decodes data, read from the file name, as size bytes: raw, hex or base64.
func decodeKey(name string, data []byte, size int) ([]byte, error) {
	if len(data) == size {
		return data, nil
	}
	text := string(bytes.TrimSpace(data))
	if b, err := hex.DecodeString(text); err == nil && len(b) == size {
		return b, nil
	}
	if b, err := base64.StdEncoding.DecodeString(text); err == nil && len(b) == size {
		return b, nil
	}
	return nil, fmt.Errorf("%s: not an Ed25519 key of %d bytes, raw, in hex or in base64", name, size)
}

// ReadPrivateKey reads an Ed25519 private key from the file name: the 64-byte key or its
// 32-byte seed, raw or in hex or base64.
func ReadPrivateKey(name string) (ed25519.PrivateKey, error) {
	if k, err := readKey(name, ed25519.PrivateKeySize); err == nil {
		return ed25519.PrivateKey(k), nil
	}
	seed, err := readKey(name, ed25519.SeedSize)
	if err != nil {
		return nil, fmt.Errorf("%s: not an Ed25519 private key (64 bytes) or seed (32 bytes), raw, in hex or in base64", name)
	}
	return ed25519.NewKeyFromSeed(seed), nil
}

// ReadPublicKey reads an Ed25519 public key (32 bytes, raw or in hex or base64) from the file name.
func ReadPublicKey(name string) (ed25519.PublicKey, error) {
	k, err := readKey(name, ed25519.PublicKeySize)
	if err != nil {
		return nil, err
	}
	return ed25519.PublicKey(k), nil
}

// Sign returns the signature file of the manifest bytes with key: the Ed25519 signature in
// base64 and a newline.
func Sign(manifest []byte, key ed25519.PrivateKey) []byte {
	return []byte(base64.StdEncoding.EncodeToString(ed25519.Sign(key, manifest)) + "\n")
}

// checkSignature checks the signature file beside the manifest against the manifest's bytes.
func (r *Report) checkSignature(dir string, manifest []byte, pub ed25519.PublicKey) {
	data, err := readInside(dir, SignatureName)
	if err != nil {
		r.problem(nil, SignatureName, "cannot be read: %v", err)
		return
	}
	if len(data) > maxKeyFile {
		r.problem(nil, SignatureName, "is not a signature")
		return
	}
	sig, err := base64.StdEncoding.DecodeString(strings.TrimSpace(string(data)))
	if err != nil || len(sig) != ed25519.SignatureSize {
		r.problem(nil, SignatureName, "is not an Ed25519 signature in base64")
		return
	}
	if !ed25519.Verify(pub, manifest, sig) {
		r.problem(nil, SignatureName, "does not hold: the manifest was not signed by the key given, or changed since")
		return
	}
	r.Signed = true
}
