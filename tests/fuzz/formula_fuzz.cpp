// Fuzzes the formula compiler and evaluator: any text as a force field "FX, FY, FZ" must either compile
// and evaluate, or fail with ergpath::Error — never crash, hang or throw anything else.
#include <cstdint>
#include <cstdlib>
#include <string>

#include "plugin/core/error.h"
#include "plugin/core/field.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  ergpath::FieldSpec spec;
  spec.forces.push_back({"f", std::string(reinterpret_cast<const char*>(data), size)});
  spec.constants = {{"m", 25.0}, {"k", 150.0}, {"mu", 0.02}};
  try {
    ergpath::FieldEvaluator field(spec);
    ergpath::FieldPoint q;
    q.position = {0.25, -0.5, 1.5};
    q.s = 0.75;
    q.tangent = {0.0, 0.6, 0.8};
    ergpath::Vec3 out[1];
    field.eval(q, out);
  } catch (const ergpath::Error&) {
    // Rejected with one of our own errors: what bad input must get.
  }
  return 0;
}
