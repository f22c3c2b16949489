// Runs a fuzz harness over files, once each, without libFuzzer: the seed corpus and every input a fuzzer
// ever found become a regression test in every build (gcc included), under the sanitizers when they are on.
//
// Usage: fuzz_replay_<name> PATH...   (a PATH may be a folder: each regular file in it is fed in name order)
#include <algorithm>
#include <cstdint>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>
#include <vector>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size);
extern "C" __attribute__((weak)) int LLVMFuzzerInitialize(int* argc, char*** argv);

namespace {

std::vector<std::filesystem::path> inputs(int argc, char** argv) {
  std::vector<std::filesystem::path> out;
  for (int i = 1; i < argc; ++i) {
    const std::filesystem::path p = argv[i];
    if (std::filesystem::is_directory(p)) {
      std::vector<std::filesystem::path> in_dir;
      for (const auto& e : std::filesystem::directory_iterator(p)) {
        if (e.is_regular_file()) in_dir.push_back(e.path());
      }
      std::sort(in_dir.begin(), in_dir.end());
      out.insert(out.end(), in_dir.begin(), in_dir.end());
    } else if (std::filesystem::is_regular_file(p)) {
      out.push_back(p);
    } else {
      std::fprintf(stderr, "fuzz replay: %s is neither a file nor a folder\n", argv[i]);
      std::exit(2);
    }
  }
  return out;
}

}  // namespace

int main(int argc, char** argv) {
  if (LLVMFuzzerInitialize) LLVMFuzzerInitialize(&argc, &argv);
  const std::vector<std::filesystem::path> files = inputs(argc, argv);
  if (files.empty()) {
    std::fprintf(stderr, "fuzz replay: no input files\n");
    return 2;
  }
  for (const auto& f : files) {
    std::ifstream in(f, std::ios::binary);
    const std::string bytes((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    LLVMFuzzerTestOneInput(reinterpret_cast<const std::uint8_t*>(bytes.data()), bytes.size());
  }
  std::printf("fuzz replay: %zu inputs, no crash\n", files.size());
  return 0;
}
