// Entry point of the DRAW plugin: `pload -ErgPath` opens this library and calls its PLUGINFACTORY.
#include <Draw_Interpretor.hxx>
#include <Draw_PluginMacro.hxx>

#include "plugin/draw/draw_commands.h"

namespace ergpath::draw {

void add_commands(Draw_Interpretor& di) {
  add_list_command(di);
  add_work_command(di);
  add_profile_command(di);
}

}  // namespace ergpath::draw

class ErgPathDrawPlugin {
 public:
  static void Factory(Draw_Interpretor& di) { ergpath::draw::add_commands(di); }
};

DPLUGIN(ErgPathDrawPlugin)
