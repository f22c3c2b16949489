// The ergpath commands of the DRAW shell, each registered with its usage string in group "ergpath".
//
// Each command is a thin door to the same library calls as the `ergpath` CLI subcommand of the same
// job (plugin/cli): same options, same report text, same errors. See docs/draw.md.
#pragma once

class Draw_Interpretor;

namespace ergpath::draw {

/// Registers every command below.
void add_commands(Draw_Interpretor& di);

/// ergpath_list SHAPE: the numbered edges of a session shape. Result: the edge count (or the JSON text).
void add_list_command(Draw_Interpretor& di);

/// ergpath_work SHAPE ...: work along a shape's own path or a selection of its edges. Result: joules.
void add_work_command(Draw_Interpretor& di);

/// ergpath_profile SHAPE ...: W(s) and F.T at stations. Result: a list of {s_m work_J force_N} triples.
void add_profile_command(Draw_Interpretor& di);

}  // namespace ergpath::draw
