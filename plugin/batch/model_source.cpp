#include "plugin/batch/model_source.h"

namespace ergpath::batch {

void ModelCache::expect(const std::string& file) {
  auto& slot = slots_[file];
  if (!slot) slot = std::make_unique<Slot>();
}

std::shared_ptr<const LoadedModel> ModelCache::get(const std::string& file) {
  auto it = slots_.find(file);
  if (it == slots_.end()) {
    throw Error(ErrorKind::UnreadableFile, file + ": model was not registered with the batch");
  }
  Slot& slot = *it->second;
  std::lock_guard<std::mutex> lock(slot.mutex);
  if (!slot.done) {
    std::lock_guard<std::mutex> reading(load_mutex_);
    ++loads_;
    try {
      slot.model = loader_(file);
    } catch (const Error& e) {
      slot.error = e;
    }
    slot.done = true;
  }
  if (slot.error) throw *slot.error;
  return slot.model;
}

}  // namespace ergpath::batch
