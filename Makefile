# pvrec: the two commands a new group member needs.
#
#   make demo   install what is missing, then execute every notebook headless and write the
#               executed notebooks and their HTML renderings to out/notebooks/
#   make test   the same installs (and Chromium, pdfLaTeX), then go vet, go test, an execution of every notebook, and a
#               look at every rendered notebook in headless Chromium (screenshots in out/notebooks/)
#
# Other targets: make setup (installs only), make bench, make reference (regenerate the committed
# reference tables in testdata/reference from Debian's python3-mpmath / python3-scipy: each generator
# prints its table on stdout, written beside it as .csv), make strip
# (clear notebook outputs before committing).

SHELL := /bin/bash
GOBIN := $(shell go env GOPATH)/bin
export PATH := $(GOBIN):$(PATH)
OUT := out/notebooks

.PHONY: demo test setup setup-jupyter setup-go setup-browser setup-tex vet gotest notebooks bench reference strip

demo: setup
	@notebooks/run.sh $(OUT)

test: setup setup-browser setup-tex vet gotest
	@notebooks/run.sh $(OUT)
	@notebooks/browser.sh $(OUT)

setup: setup-jupyter setup-go

# Debian's Jupyter pieces. As root they are installed with apt; otherwise we say what to install.
setup-jupyter:
	@if /usr/bin/python3 -c 'import nbconvert, jupyter_client, ipykernel' 2>/dev/null && command -v jupyter-nbconvert >/dev/null; then \
		echo "setup: Jupyter (nbconvert, jupyter-client, ipykernel) present"; \
	elif [ "$$(id -u)" = 0 ]; then \
		echo "setup: installing Debian's jupyter-nbconvert, jupyter-client, python3-ipykernel"; \
		apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends \
			jupyter-nbconvert jupyter-client python3-ipykernel >/dev/null; \
	else \
		echo "setup: please install Debian's jupyter-nbconvert, jupyter-client and python3-ipykernel"; \
		echo "       (sudo apt-get install jupyter-nbconvert jupyter-client python3-ipykernel), then rerun"; \
		exit 1; \
	fi

# Debian's Chromium, in which make test opens every rendered notebook as a reader would, and
# the Liberation fonts the figures are laid out in (inline SVG names them; without them a
# browser falls back to a wider face and labels overflow).
setup-browser:
	@if command -v chromium >/dev/null && fc-list 2>/dev/null | grep -qi 'Liberation Sans'; then \
		echo "setup: Chromium and the Liberation fonts present"; \
	elif [ "$$(id -u)" = 0 ]; then \
		echo "setup: installing Debian's chromium and fonts-liberation"; \
		apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends chromium fonts-liberation fontconfig >/dev/null; \
	else \
		echo "setup: please install Debian's chromium and fonts-liberation (sudo apt-get install chromium fonts-liberation), then rerun"; \
		exit 1; \
	fi

# Debian's pdfLaTeX and pgf (texlive-latex-base, texlive-pictures; about 230 MB), with which the
# plots tests compile the TeX export (TestTeXCompiles; skipped where pdflatex is missing).
setup-tex:
	@if command -v pdflatex >/dev/null && kpsewhich pgf.sty >/dev/null 2>&1; then \
		echo "setup: pdflatex and pgf present"; \
	elif [ "$$(id -u)" = 0 ]; then \
		echo "setup: installing Debian's texlive-latex-base and texlive-pictures"; \
		apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends texlive-latex-base texlive-pictures >/dev/null; \
	else \
		echo "setup: pdflatex or pgf missing; the TeX-export test will be skipped (sudo apt-get install texlive-latex-base texlive-pictures to run it)"; \
	fi

# GoNB (pinned in go.mod), goimports and gopls, and the GoNB kernel registration.
setup-go:
	@if [ ! -x "$(GOBIN)/gonb" ]; then echo "setup: installing GoNB (version pinned in go.mod)"; go install github.com/janpfeifer/gonb; fi
	@if [ ! -x "$(GOBIN)/goimports" ]; then echo "setup: installing goimports"; go install golang.org/x/tools/cmd/goimports@v0.38.0; fi
	@if [ ! -x "$(GOBIN)/gopls" ]; then echo "setup: installing gopls v0.21.1"; go install golang.org/x/tools/gopls@v0.21.1; fi
	@if ! jupyter kernelspec list 2>/dev/null | grep -qw gonb; then echo "setup: registering the GoNB kernel"; gonb --install >/dev/null 2>&1; fi
	@echo "setup: GoNB, goimports, gopls and the gonb kernel present"

vet:
	go vet ./...

gotest:
	go test ./...
	@go test -count=1 -run 'TestBattery$$' -v ./pvrec/internal/battery | grep '^battery:'


bench:
	go test -run '^$$' -bench . -benchmem ./...

reference:
	@/usr/bin/python3 -c 'import mpmath, scipy' 2>/dev/null || { echo "reference: needs Debian's python3-mpmath and python3-scipy"; exit 1; }
	@for g in testdata/reference/*.py; do echo "reference: $$g -> $${g%.py}.csv"; /usr/bin/python3 $$g > $${g%.py}.csv.new && mv $${g%.py}.csv.new $${g%.py}.csv || exit 1; done

strip:
	jupyter nbconvert --clear-output --inplace notebooks/*.ipynb
