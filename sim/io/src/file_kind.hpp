#pragma once
// Words for what a path is, for refusals such as "not a regular file (a FIFO)".
#include <sys/stat.h>

namespace brownfloc::io::detail {

inline const char* file_kind_name(mode_t mode) {
    if (S_ISDIR(mode)) return "a directory";
    if (S_ISFIFO(mode)) return "a FIFO";
    if (S_ISCHR(mode)) return "a character device";
    if (S_ISBLK(mode)) return "a block device";
    if (S_ISSOCK(mode)) return "a socket";
    if (S_ISLNK(mode)) return "a symbolic link";
    if (S_ISREG(mode)) return "a regular file";
    return "an unknown kind of file";
}

inline const char* not_regular_reason(mode_t mode) {
    if (S_ISDIR(mode)) return "not a regular file (a directory)";
    if (S_ISFIFO(mode)) return "not a regular file (a FIFO)";
    if (S_ISCHR(mode)) return "not a regular file (a character device)";
    if (S_ISBLK(mode)) return "not a regular file (a block device)";
    if (S_ISSOCK(mode)) return "not a regular file (a socket)";
    if (S_ISLNK(mode)) return "not a regular file (a symbolic link)";
    return "not a regular file";
}

}  // namespace brownfloc::io::detail
