package main

import (
	"fmt"

	"github.com/urfave/cli/v2"
)

func init() { register(95, completionCommand) }

// The scripts call the program with urfave/cli's hidden
// --generate-bash-completion flag, which lists the commands and flags
// valid at the cursor; they follow the scripts shipped with urfave/cli
// v2 (autocomplete/bash_autocomplete and zsh_autocomplete).
const bashCompletion = `# bash completion for centra; load with: source <(centra completion bash)
_centra_complete() {
  local cur="${COMP_WORDS[COMP_CWORD]}"
  local words=("${COMP_WORDS[@]:0:$COMP_CWORD}")
  local opts
  if [[ "$cur" == "-"* ]]; then
    opts=$("${words[@]}" "$cur" --generate-bash-completion 2>/dev/null)
  else
    opts=$("${words[@]}" --generate-bash-completion 2>/dev/null)
  fi
  COMPREPLY=($(compgen -W "${opts}" -- "${cur}"))
}
complete -o bashdefault -o default -o nospace -F _centra_complete centra
`

const zshCompletion = `#compdef centra
# zsh completion for centra; load with: source <(centra completion zsh)
_centra() {
  local -a opts
  local cur=${words[-1]}
  if [[ "$cur" == "-"* ]]; then
    opts=("${(@f)$(${words[@]:0:#words[@]-1} ${cur} --generate-bash-completion 2>/dev/null)}")
  else
    opts=("${(@f)$(${words[@]:0:#words[@]-1} --generate-bash-completion 2>/dev/null)}")
  fi
  if [[ "${opts[1]}" != "" ]]; then
    _describe 'values' opts
  else
    _files
  fi
}
compdef _centra centra
`

func completionCommand() *cli.Command {
	return &cli.Command{
		Name:      "completion",
		Usage:     "print a shell completion script (bash or zsh)",
		ArgsUsage: "SHELL",
		UsageText: `centra completion bash|zsh

examples:
  centra completion bash
  source <(centra completion bash)
  centra completion zsh > "${fpath[1]}/_centra"`,
		Action: func(c *cli.Context) error {
			switch c.Args().First() {
			case "bash":
				_, err := fmt.Fprint(c.App.Writer, bashCompletion)
				return err
			case "zsh":
				_, err := fmt.Fprint(c.App.Writer, zshCompletion)
				return err
			}
			return inputErrorf("use 'centra completion bash' or 'centra completion zsh'", "completion needs a shell name, bash or zsh")
		},
	}
}
