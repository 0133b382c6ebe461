// Replaces the global operator new/delete of the test executable (the replaceable forms of
// [new.delete]) with malloc/free plus a record of the largest request. Every non-aligned form
// is replaced, not only the two that libstdc++'s others forward to: under AddressSanitizer the
// runtime supplies the others itself, and a mix would pair its new with our delete.
// Over-aligned forms are left alone (they pair with their own deletes; nothing here uses them).
#include "allocation_probe.hpp"

#include <atomic>
#include <cstdlib>
#include <new>

namespace {

std::atomic<std::size_t> largest{0};

void* allocate(std::size_t bytes) noexcept {
    std::size_t seen = largest.load(std::memory_order_relaxed);
    while (bytes > seen && !largest.compare_exchange_weak(seen, bytes, std::memory_order_relaxed)) {
    }
    return std::malloc(bytes == 0 ? 1 : bytes);
}

void* allocate_or_throw(std::size_t bytes) {
    if (void* p = allocate(bytes)) return p;
    throw std::bad_alloc{};
}

}  // namespace

namespace brownfloc::test {

void reset_largest_allocation() { largest.store(0); }
std::size_t largest_allocation_bytes() { return largest.load(); }

}  // namespace brownfloc::test

void* operator new(std::size_t bytes) { return allocate_or_throw(bytes); }
void* operator new[](std::size_t bytes) { return allocate_or_throw(bytes); }
void* operator new(std::size_t bytes, const std::nothrow_t&) noexcept { return allocate(bytes); }
void* operator new[](std::size_t bytes, const std::nothrow_t&) noexcept { return allocate(bytes); }
void operator delete(void* p) noexcept { std::free(p); }
void operator delete[](void* p) noexcept { std::free(p); }
void operator delete(void* p, std::size_t) noexcept { std::free(p); }
void operator delete[](void* p, std::size_t) noexcept { std::free(p); }
void operator delete(void* p, const std::nothrow_t&) noexcept { std::free(p); }
void operator delete[](void* p, const std::nothrow_t&) noexcept { std::free(p); }
