package gosrc

import "testing"

func TestFiles(t *testing.T) {
	fs, err := Files(".", "gosrc")
	if err != nil || len(fs) != 1 || fs[0].Name.Name != "gosrc" {
		t.Fatalf("Files = %d files, %v", len(fs), err)
	}
	if _, err := Files("no-such-dir", "x"); err == nil {
		t.Error("missing folder: no error")
	}
}
