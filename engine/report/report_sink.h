// Where a renderer writes a report. The text is appended to a buffer; a
// sink given a writer hands the buffer on at checkpoints (after a step, a
// check, a table row) once it holds kChunk bytes, so that a report of a
// large sheet is written as it is made instead of held whole.
#pragma once

#include <cstddef>
#include <functional>
#include <string>
#include <string_view>

#include <fmt/format.h>

namespace calctrail {

class ReportSink {
 public:
  using Writer = std::function<bool(std::string_view piece)>;
  static constexpr size_t kChunk = 64 * 1024;

  // Holds the whole report (text()).
  ReportSink() = default;
  // Hands the report to `write` piece by piece, in order.
  // Room for a chunk and what passes it before a checkpoint is made at once,
  // not grown half again at a time (each growth copies what it holds).
  explicit ReportSink(Writer write) : write_(std::move(write)) { buffer_.reserve(kChunk + kChunk / 4); }
  ReportSink(const ReportSink&) = delete;
  ReportSink& operator=(const ReportSink&) = delete;

  fmt::memory_buffer& buffer() { return buffer_; }
  // A place where the renderer may be interrupted: what the buffer holds is
  // written when it is kChunk or more. Nothing happens without a writer.
  void checkpoint() {
    if (write_ && buffer_.size() >= kChunk) drain();
  }
  // Writes the rest; false when any write failed (the rest is then dropped).
  bool finish() {
    if (write_) drain();
    return !failed_;
  }
  // Everything appended, for a sink without a writer.
  std::string text() const { return fmt::to_string(buffer_); }

 private:
  void drain() {
    if (!failed_ && buffer_.size() > 0) failed_ = !write_(std::string_view(buffer_.data(), buffer_.size()));
    buffer_.clear();
  }

  fmt::memory_buffer buffer_;
  Writer write_;
  bool failed_ = false;
};

}  // namespace calctrail
