#include "field_file.h"

#include <toml++/toml.h>

#include <algorithm>
#include <fstream>
#include <sstream>

#include "error.h"
#include "units.h"

namespace ergpath {

namespace {

std::string at(const std::string& origin, const toml::node& node) {
  const auto& src = node.source();
  return origin + ":" + std::to_string(src.begin.line);
}

[[noreturn]] void fail(const std::string& where, const std::string& what) {
  throw Error(ErrorKind::BadManifest, where + ": " + what);
}

double number(const toml::node& node, const std::string& origin, const std::string& key) {
  if (auto v = node.value<double>()) return *v;  // toml++ converts integers to double here
  fail(at(origin, node), "'" + key + "' must be a number");
}

std::string text(const toml::node& node, const std::string& origin, const std::string& key) {
  if (auto v = node.value<std::string>()) return *v;
  fail(at(origin, node), "'" + key + "' must be a string");
}

}  // namespace

void apply_field_table(const toml::table& table, const std::string& origin, FieldSpec& spec,
                       const std::vector<std::string>& ignore) {
  for (const auto& [k, node] : table) {
    const std::string key(k.str());
    if (std::find(ignore.begin(), ignore.end(), key) != ignore.end()) continue;
    if (key == "length_unit") {
      try {
        spec.length_unit_m = length_unit_m(text(node, origin, key));
      } catch (const Error& e) {
        fail(at(origin, node), e.what());
      }
    } else if (key == "potential") {
      spec.potential = text(node, origin, key);
    } else if (key == "constants") {
      const toml::table* t = node.as_table();
      if (!t) fail(at(origin, node), "'constants' must be a table of name = number");
      for (const auto& [ck, cv] : *t) {
        const std::string name(ck.str());
        const double value = number(cv, origin, name);
        auto it = std::find_if(spec.constants.begin(), spec.constants.end(),
                               [&](const auto& c) { return c.first == name; });
        if (it != spec.constants.end())
          it->second = value;
        else
          spec.constants.emplace_back(name, value);
      }
    } else if (key == "forces") {
      const toml::table* t = node.as_table();
      if (!t) fail(at(origin, node), "'forces' must be a table of name = \"FX, FY, FZ\"");
      for (const auto& [fk, fv] : *t) {
        const std::string name(fk.str());
        const std::string formula = text(fv, origin, name);
        auto it = std::find_if(spec.forces.begin(), spec.forces.end(),
                               [&](const NamedField& f) { return f.name == name; });
        if (it != spec.forces.end())
          it->formula = formula;
        else
          spec.forces.push_back({name, formula});
      }
    } else {
      fail(at(origin, node),
           "unknown key '" + key + "' (expected length_unit, potential, [constants] or [forces])");
    }
  }
}

FieldSpec parse_field_text(const std::string& text_in, const std::string& origin) {
  toml::table table;
  try {
    table = toml::parse(text_in, origin);
  } catch (const toml::parse_error& e) {
    throw Error(ErrorKind::BadManifest,
                origin + ":" + std::to_string(e.source().begin.line) + ": " + std::string(e.description()));
  }
  FieldSpec spec;
  apply_field_table(table, origin, spec);
  if (spec.forces.empty()) {
    throw Error(ErrorKind::BadManifest, origin + ": no [forces] given");
  }
  return spec;
}

FieldSpec read_field_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw Error(ErrorKind::BadManifest, path + ": cannot open field file");
  std::ostringstream ss;
  ss << in.rdbuf();
  return parse_field_text(ss.str(), path);
}

}  // namespace ergpath
