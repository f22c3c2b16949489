#include "text_models.h"

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <stdexcept>
#include <vector>

#include <unistd.h>

#include "plugin/core/analytic_curves.h"
#include "plugin/core/error.h"

namespace ergpath::batch::testing {

namespace {

class TextModel : public LoadedModel {
 public:
  TextModel(std::string file, std::string kind, std::vector<double> numbers)
      : file_(std::move(file)), kind_(std::move(kind)), n_(std::move(numbers)) {}

  Path build_path(const PathRequest& request) const override {
    if (request.selector != "all") {
      throw Error(ErrorKind::BadSelector, file_ + ": selector '" + request.selector + "' not understood");
    }
    Path p;
    p.length_unit_m = 1e-3;
    if (kind_ == "line") {
      p.segments.push_back({std::make_shared<LineCurve>(Vec3{n_[0], n_[1], n_[2]}, Vec3{n_[3], n_[4], n_[5]}),
                            request.reverse, 1, ""});
    } else {
      p.segments.push_back(
          {std::make_shared<EllipseCurve>(Vec3{n_[0], n_[1], 0.0}, n_[2], n_[2], 0.0, 2 * M_PI),
           request.reverse, 1, ""});
      p.closed = true;
    }
    return p;
  }

 private:
  std::string file_, kind_;
  std::vector<double> n_;
};

}  // namespace

ModelLoader text_model_loader(std::atomic<int>* loads) {
  return [loads](const std::string& file) -> std::shared_ptr<const LoadedModel> {
    if (loads) ++*loads;
    std::ifstream in(file);
    if (!in) throw Error(ErrorKind::UnreadableFile, file + ": cannot open");
    std::string kind;
    in >> kind;
    std::vector<double> n;
    double v;
    while (in >> v) n.push_back(v);
    if (!((kind == "line" && n.size() == 6) || (kind == "circle" && n.size() == 3))) {
      throw Error(ErrorKind::UnreadableFile, file + ": not a text model");
    }
    return std::make_shared<TextModel>(file, kind, n);
  };
}

namespace {

// Folders made by fresh_dir, removed when the test program ends.
struct MadeDirs {
  std::vector<std::string> dirs;
  ~MadeDirs() {
    for (const std::string& d : dirs) {
      std::error_code ec;
      std::filesystem::remove_all(d, ec);
    }
  }
};
MadeDirs made_dirs;

}  // namespace

std::string fresh_dir(const std::string& prefix) {
  const char* tmp = std::getenv("TMPDIR");
  std::string tmpl = std::string(tmp ? tmp : "/tmp") + "/" + prefix + "XXXXXX";
  std::vector<char> buf(tmpl.begin(), tmpl.end());
  buf.push_back('\0');
  if (!mkdtemp(buf.data())) throw std::runtime_error("mkdtemp failed");
  made_dirs.dirs.push_back(buf.data());
  return buf.data();
}

void write_file(const std::string& path, const std::string& text) {
  std::ofstream out(path, std::ios::binary | std::ios::trunc);
  out << text;
  if (!out) throw std::runtime_error("cannot write " + path);
}

std::string read_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

}  // namespace ergpath::batch::testing
